"""volev_tools against the real program ($VOLEV_BIN, default build/volev): the demo
candidate (scenarios/demo.cfg) wet and dry over its first Gyr, a small grid and a small
Saltelli sweep (tests/data/sweep/), a balance and a comparison. Every table is checked
against the text of the file it was read from (row counts, header, values as written,
empty fields), once per backend (support.BACKENDS)."""

import os
import shutil
import subprocess
import tempfile
import unittest

import support
from support import (BACKENDS, BIN, TOP, data_lines, first_line, header_line, is_missing,
                     summary_text)
import volev_tools as vt

SCENARIO = os.path.join(TOP, "scenarios", "demo.cfg")
END_YR = 1.0e9  # past the demo's magma ocean (solidified near 6.7e8 yr at full length)
WORK = None


def setUpModule():
    global WORK
    support.need_binary(None)
    WORK = tempfile.mkdtemp(prefix="volev-tools-")
    short = {"run.end_yr": END_YR}
    vt.run(SCENARIO, os.path.join(WORK, "wet"), overrides=short, binary=BIN, backend="columns")
    vt.run(SCENARIO, os.path.join(WORK, "wet2"), binary=BIN, backend="columns",
           overrides=dict(short, **{"inventory.surface_water_to": 5.0}))
    vt.run(SCENARIO, os.path.join(WORK, "dry"), binary=BIN, backend="columns",
           overrides=dict(short, **{"inventory.surface_water_to": 0.0}))
    for name in ("grid", "saltelli"):
        vt.sweep(os.path.join(TOP, "tests", "data", "sweep", name + ".cfg"),
                 os.path.join(WORK, name), threads=1, binary=BIN, backend="columns")


def tearDownModule():
    if WORK:
        shutil.rmtree(WORK, ignore_errors=True)


def program_version():
    """`volev --version`'s version and git revision: 'volev VERSION (git REV)'."""
    out = subprocess.run([BIN, "--version"], stdout=subprocess.PIPE, text=True,
                         check=True).stdout.split()
    return out[1], out[3].rstrip(")")


def tables_of(run):
    return {"series.csv": run.series, "events.csv": run.events, "summary.csv": run.summary}


class RunFolder:
    backend = None

    def read(self, name):
        return vt.read_run(os.path.join(WORK, name), backend=self.backend)

    def test_backend_as_asked(self):
        self.assertEqual(vt.is_frame(self.read("wet").series), self.backend == "pandas")

    def test_rows_and_header_as_in_the_files(self):
        for name in ("wet", "dry"):
            run = self.read(name)
            for file, table in tables_of(run).items():
                path = os.path.join(run.folder, file)
                with self.subTest(run=name, file=file):
                    self.assertEqual(vt.nrows(table), len(data_lines(path)))
                    names = list(table.columns) if vt.is_frame(table) else list(table)
                    self.assertEqual(",".join(names), header_line(path))

    def test_values_as_written(self):
        run = self.read("wet")
        path = os.path.join(run.folder, "summary.csv")
        for row in ("final_surface_water_to", "final_o2", "water_lost_to_space"):
            self.assertEqual(run.value(row), float(summary_text(path, row)))
        self.assertEqual(run.unit("final_o2"), "bar")
        last = data_lines(os.path.join(run.folder, "series.csv"))[-1].split(",")
        header = header_line(os.path.join(run.folder, "series.csv")).split(",")
        k = header.index("surface_temp_k")
        self.assertEqual(vt.column(run.series, "surface_temp_k")[-1], float(last[k]))
        self.assertEqual(vt.column(run.series, "regime")[-1], int(last[header.index("regime")]))

    def test_overrides_reached_the_run(self):
        # The history ends at run.end_yr: the last event is 'end' at the overridden age.
        for name in ("wet", "dry"):
            events = vt.records(self.read(name).events)
            self.assertEqual((events[-1]["event"], events[-1]["time_yr"]), ("end", END_YR))
        self.assertEqual(self.read("dry").value("final_surface_water_to"), 0.0)

    def test_empty_field_is_no_value(self):
        # A run that starts dry has no D/H of its water: the field is empty
        # (docs/columns.md, summary.csv final_dh_water).
        run = self.read("dry")
        self.assertEqual(summary_text(os.path.join(run.folder, "summary.csv"), "final_dh_water"), "")
        self.assertIsNone(run.value("final_dh_water"))
        names = vt.column(run.summary, "name")
        raw_value = (run.summary["value"].tolist() if vt.is_frame(run.summary)
                     else run.summary["value"])[names.index("final_dh_water")]
        self.assertTrue(is_missing(raw_value))

    def test_metadata(self):
        run = self.read("wet")
        version, rev = program_version()
        for file in ("series", "events", "summary"):
            self.assertEqual(run.meta[file]["version"], version)
            self.assertEqual(run.meta[file]["git_revision"], rev)
        self.assertEqual(run.version, version)
        hashes = {run.meta[f]["scenario_hash"] for f in ("series", "events", "summary")}
        self.assertEqual(len(hashes), 1)
        self.assertIn("regime", run.meta["series"])  # the code meanings of the series

    def test_units_for_every_series_column(self):
        reference = vt.column_reference(BIN)["series.csv"]
        for name in vt.records(self.read("wet").series)[0]:
            self.assertIn(name, reference)

    def test_failed_run_carries_volev_message(self):
        with self.assertRaises(vt.VolevError) as cm:
            vt.run(SCENARIO, os.path.join(WORK, "never"), binary=BIN, backend=self.backend,
                   overrides={"planet.orbit_aus": 0.1})
        self.assertEqual(cm.exception.returncode, 3)  # bad scenario (volev --help)
        self.assertIn("planet.orbit_aus", cm.exception.stderr)
        self.assertIn(cm.exception.stderr.strip(), str(cm.exception))
        self.assertFalse(os.path.exists(os.path.join(WORK, "never", "summary.csv")))

    def test_truncated_copy_refused(self):
        copy = os.path.join(WORK, "cut-" + self.backend)
        shutil.copytree(os.path.join(WORK, "wet"), copy)
        path = os.path.join(copy, "series.csv")
        size = os.path.getsize(path)
        with open(path, "r+b") as f:
            f.truncate(size - 7)
        with self.assertRaises(vt.OutputError) as cm:
            vt.read_run(copy, backend=self.backend)
        self.assertEqual(cm.exception.path, path)
        self.assertIn("truncated", str(cm.exception))

    def test_missing_folder(self):
        with self.assertRaises(vt.OutputError) as cm:
            vt.read_run(os.path.join(WORK, "absent"), backend=self.backend)
        self.assertIn("no such run folder", str(cm.exception))


class SweepFolder:
    backend = None

    def read(self, name):
        return vt.read_sweep(os.path.join(WORK, name), backend=self.backend)

    def test_rows_as_in_the_files(self):
        for name in ("grid", "saltelli"):
            sweep = self.read(name)
            tables = {"members.csv": sweep.members, "ensemble_summary.csv": sweep.ensemble_summary,
                      "ensemble_series.csv": sweep.ensemble_series}
            if name == "saltelli":
                tables["sensitivity.csv"] = sweep.sensitivity
            for file, table in tables.items():
                with self.subTest(sweep=name, file=file):
                    self.assertEqual(vt.nrows(table), len(data_lines(os.path.join(sweep.folder, file))))

    def test_members_and_axes(self):
        grid = self.read("grid")
        # tests/data/sweep/grid.cfg: 3 x 2 grid points over these two keys
        self.assertEqual(grid.axes, ["inventory.surface_water_to", "planet.orbit_au"])
        self.assertEqual(grid.meta["members"]["members"], 6)
        self.assertEqual(vt.column(grid.members, "member"), list(range(6)))
        self.assertEqual(sorted(set(vt.column(grid.members, "planet.orbit_au"))), [0.08, 0.12])
        self.assertIsNone(grid.sensitivity)
        self.assertEqual(grid.version, program_version()[0])

    def test_empty_outcome_is_no_value(self):
        grid = self.read("grid")
        path = os.path.join(grid.folder, "members.csv")
        header = header_line(path).split(",")
        k = header.index("first_moist_yr")
        written = [line.split(",")[k] for line in data_lines(path)]
        read = vt.column(grid.members, "first_moist_yr")
        for text, value in zip(written, read):
            self.assertEqual(value is None, text == "")
            if text:
                self.assertEqual(value, float(text))


class OtherOutputs:
    backend = None

    def test_balance(self):
        folder = os.path.join(WORK, "balance-" + self.backend)
        table = vt.balance(SCENARIO, folder, age_yr=1e9, binary=BIN, backend=self.backend)
        path = os.path.join(folder, "balance.csv")
        self.assertEqual(vt.nrows(table.data), len(data_lines(path)))
        self.assertEqual(table.meta["version"], program_version()[0])
        self.assertEqual(first_line(path), "# " + table.meta["comments"][0])

    def test_compare(self):
        folder = os.path.join(WORK, "compare-" + self.backend)
        try:
            vt.runner.invoke(["compare", os.path.join(WORK, "wet"), os.path.join(WORK, "wet2"),
                              "-o", folder], BIN)
        except vt.VolevError as e:
            if e.returncode == 6:
                self.skipTest("gnuplot missing: %s" % e.stderr.strip())
            raise
        table = vt.read_compare(folder, backend=self.backend)
        path = os.path.join(folder, "compare.csv")
        self.assertEqual(vt.nrows(table.data), len(data_lines(path)))
        self.assertEqual(table.meta["version"], program_version()[0])
        rows = {r["quantity"]: r for r in vt.records(table.data)}
        wet = vt.read_run(os.path.join(WORK, "wet"), backend="columns")
        self.assertEqual(rows["final_o2"]["a"], wet.value("final_o2"))


def backend_classes(base):
    for backend in BACKENDS:
        name = "%s_%s" % (base.__name__, backend)
        globals()[name] = type(name, (base, unittest.TestCase), {"backend": backend})


for _base in (RunFolder, SweepFolder, OtherOutputs):
    backend_classes(_base)


class Switches(unittest.TestCase):
    def test_no_pandas_flag(self):
        old = os.environ.get("VOLEV_TOOLS_NO_PANDAS")
        os.environ["VOLEV_TOOLS_NO_PANDAS"] = "1"
        try:
            run = vt.read_run(os.path.join(WORK, "wet"))
        finally:
            if old is None:
                del os.environ["VOLEV_TOOLS_NO_PANDAS"]
            else:
                os.environ["VOLEV_TOOLS_NO_PANDAS"] = old
        self.assertIsInstance(run.series, dict)

    def test_no_program(self):
        with self.assertRaises(FileNotFoundError):
            vt.run(SCENARIO, os.path.join(WORK, "never"), binary=os.path.join(WORK, "nothing"))

    def test_bad_override_values(self):
        for value, error in ((float("nan"), ValueError), ([1, 2], TypeError), ("a\nb", ValueError)):
            with self.assertRaises(error):
                vt.runner.set_arguments({"planet.orbit_au": value})
        self.assertEqual(vt.runner.set_arguments({"a.b": True, "c.d": 0.1, "e.f": 3}),
                         ["--set", "a.b=true", "--set", "c.d=0.1", "--set", "e.f=3"])


if __name__ == "__main__":
    unittest.main()
