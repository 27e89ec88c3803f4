"""The CSV layer of volev_tools on small hand-written files in volev's layout
(docs/columns.md, docs/hardening.md "Outputs"): metadata, typing, empty fields, quoted
and rest-of-line fields, and the errors for missing, truncated and damaged files."""

import os
import tempfile
import unittest

import support  # noqa: F401  (puts python/ on sys.path)
from support import BACKENDS, is_missing
from volev_tools import OutputError, column, nrows, read_csv, read_run
from volev_tools.csvfile import read_raw

RUN_SUMMARY = ("# volev 9.8.7 (git abc123)\n"
               "# resolved scenario hash (FNV-1a 64): 00ff00ff00ff00ff\n"
               "# scenario: somewhere.cfg\n"
               "name,value,unit\n"
               "final_dh_water,,ratio\n"
               "steps,12,count\n"
               "final_o2,1.5e-3,bar\n")


class CsvLayer(unittest.TestCase):
    def setUp(self):
        self.dir = tempfile.TemporaryDirectory(prefix="volev-tools-")
        self.addCleanup(self.dir.cleanup)

    def write(self, name, text):
        path = os.path.join(self.dir.name, name)
        with open(path, "w", encoding="utf-8", newline="") as f:
            f.write(text)
        return path

    def test_metadata_of_the_comment_lines(self):
        raw = read_raw(self.write("summary.csv", RUN_SUMMARY))
        self.assertEqual(raw.meta["version"], "9.8.7")
        self.assertEqual(raw.meta["git_revision"], "abc123")
        self.assertEqual(raw.meta["scenario_hash"], "00ff00ff00ff00ff")
        self.assertEqual(raw.meta["scenario"], "somewhere.cfg")
        self.assertEqual(len(raw.meta["comments"]), 3)

    def test_sweep_comment_lines(self):
        text = ("# volev 1.0 (git x)\n"
                "# sweep hash 0123abcd of a b.cfg: grid, 6 members\n"
                "# axis planet.orbit_au grid linear 0.08 0.12 2\n"
                "member,planet.orbit_au\n0,0.08\n")
        meta = read_raw(self.write("members.csv", text)).meta
        self.assertEqual((meta["sweep_hash"], meta["scenario"], meta["design"], meta["members"]),
                         ("0123abcd", "a b.cfg", "grid", 6))
        self.assertEqual(meta["axes"], [{"key": "planet.orbit_au",
                                         "spec": "grid linear 0.08 0.12 2"}])

    def test_columns_typed_and_empty_fields_none(self):
        raw = read_raw(self.write("summary.csv", RUN_SUMMARY))
        self.assertEqual(raw.kinds, {"name": "text", "value": "float", "unit": "text"})
        self.assertEqual(raw.columns["value"], [None, 12.0, 1.5e-3])
        text = "a,b,c,d\n1,,x,\n-2,3,,\n"
        raw = read_raw(self.write("t.csv", text))
        self.assertEqual(raw.kinds, {"a": "int", "b": "int", "c": "text", "d": "int"})
        self.assertEqual(raw.columns["b"], [None, 3])
        self.assertEqual(raw.columns["c"], ["x", None])
        self.assertEqual(raw.columns["d"], [None, None])

    def test_nan_and_hex_text_is_not_a_number(self):
        # volev never writes nan, inf or hexadecimal (docs/hardening.md): such a field
        # stays text (never a float NaN); the numbers beside it in a mixed column are
        # numbers, as a compare.csv value column beside the final regime's name
        raw = read_raw(self.write("t.csv", "a,b\nnan,0x10\n1,2\n"))
        self.assertEqual(raw.kinds, {"a": "mixed", "b": "mixed"})
        self.assertEqual(raw.columns["a"], ["nan", 1.0])
        self.assertEqual(raw.columns["b"], ["0x10", 2.0])
        raw = read_raw(self.write("t.csv", "a\nnan\ninf\n"))
        self.assertEqual(raw.kinds, {"a": "text"})

    def test_quoted_field_with_comma_and_quote(self):
        text = 'member,reason\n0,"bad value, ""x"" here"\n1,\n'
        raw = read_raw(self.write("members.csv", text))
        self.assertEqual(raw.columns["reason"], ['bad value, "x" here', None])

    def test_rest_of_line_field(self):
        text = "time_yr,event,detail\n1,reservoir_exhausted,a, b, c\n"
        raw = read_raw(self.write("events.csv", text), rest=True)
        self.assertEqual(raw.columns["detail"], ["a, b, c"])

    def test_backends_give_none_or_nan(self):
        path = self.write("summary.csv", RUN_SUMMARY)
        for backend in BACKENDS:
            with self.subTest(backend=backend):
                table = read_csv(path, backend=backend)
                self.assertEqual(nrows(table.data), 3)
                values = column(table.data, "value")
                self.assertTrue(values[0] is None)
                self.assertEqual(values[1:], [12.0, 1.5e-3])
                if backend == "pandas":
                    self.assertTrue(is_missing(table.data["value"][0]))
                    self.assertEqual(table.data.attrs["meta"]["version"], "9.8.7")

    def test_missing_file(self):
        with self.assertRaises(OutputError) as cm:
            read_raw(os.path.join(self.dir.name, "series.csv"))
        self.assertIn("series.csv", str(cm.exception))
        self.assertIn("no such file", str(cm.exception))

    def test_missing_run_file_named(self):
        self.write("series.csv", "time_yr\n1\n")
        self.write("events.csv", "time_yr,event,detail\n1,start,dry\n")
        with self.assertRaises(OutputError) as cm:
            read_run(self.dir.name)
        self.assertEqual(os.path.basename(cm.exception.path), "summary.csv")

    def test_run_folder_event_detail_keeps_its_commas(self):
        # events.csv's detail is free text that runs to the end of the line (docs/columns.md)
        self.write("series.csv", "time_yr,regime\n1,2\n")
        self.write("events.csv", "time_yr,event,detail\n1,reservoir_exhausted,a, b\n")
        self.write("summary.csv", RUN_SUMMARY)
        run = read_run(self.dir.name, backend="columns")
        self.assertEqual(run.events["detail"], ["a, b"])
        self.assertIsNone(run.value("final_dh_water"))
        self.assertEqual(run.value("steps"), 12.0)
        self.assertIsNone(run.scenario_path)

    def test_truncated_last_line(self):
        path = self.write("summary.csv", RUN_SUMMARY + "steps,1")
        with self.assertRaises(OutputError) as cm:
            read_raw(path)
        self.assertEqual(cm.exception.line, 8)
        self.assertIn("truncated", str(cm.exception))

    def test_empty_and_header_less_files(self):
        for text, words in (("", "empty file"), ("# volev 1 (git x)\n", "no header line")):
            with self.subTest(text=text):
                with self.assertRaises(OutputError) as cm:
                    read_raw(self.write("t.csv", text))
                self.assertIn(words, str(cm.exception))

    def test_row_with_wrong_field_count(self):
        path = self.write("t.csv", "# c\na,b\n1,2\n3\n")
        with self.assertRaises(OutputError) as cm:
            read_raw(path)
        self.assertEqual(cm.exception.line, 4)
        self.assertIn("1 fields where the header has 2", str(cm.exception))

    def test_wrong_kind_of_file(self):
        path = self.write("summary.csv", "time_yr,event,detail\n1,start,dry\n")
        with self.assertRaises(OutputError) as cm:
            read_raw(path, ("name", "value", "unit"), "volev run summary")
        self.assertIn("not a volev run summary", str(cm.exception))
        self.assertEqual(cm.exception.line, 1)

    def test_not_utf8(self):
        path = os.path.join(self.dir.name, "t.csv")
        with open(path, "wb") as f:
            f.write(b"a,b\n\xff,1\n")
        with self.assertRaises(OutputError) as cm:
            read_raw(path)
        self.assertIn("not UTF-8", str(cm.exception))

    def test_unknown_backend(self):
        with self.assertRaises(ValueError):
            read_csv(self.write("t.csv", "a\n1\n"), backend="arrow")


if __name__ == "__main__":
    unittest.main()
