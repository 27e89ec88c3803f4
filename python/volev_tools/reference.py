"""Units and meanings of the output columns, from volev itself.

`volev columns` prints the output schema (the text of docs/columns.md): a "## FILE"
section per file, with Markdown tables `| column | unit | meaning |` (or, for
summary.csv, `| name | unit | meaning |`). The process flux and redox columns come in
tables `| column | process | meaning |` whose unit is stated once in the paragraph above
them, as its first parenthesised text ("(kg/s)", "(kg O-equivalent/s, signed: ...)"):
that text, up to a comma, is taken as their unit. Names with <...> (summary.csv's
final_<reservoir>) are patterns, kept as written. Nothing here is invented: a unit
volev does not state is None.
"""

import re

from .runner import invoke

_ROW = re.compile(r"\|\s*`([^`]+)`\s*\|([^|]*)\|(.*)\|\s*\Z")
_HEAD = re.compile(r"\|\s*(\w+)\s*\|\s*(\w+)\s*\|\s*(\w+)\s*\|\s*\Z")
_PAREN_UNIT = re.compile(r"\(([^,)]+)")


class ColumnInfo:
    """One column or summary row: unit (text, None when not stated), meaning, process
    (the process a flux column belongs to, else None)."""

    def __init__(self, unit, meaning, process=None):
        self.unit = unit
        self.meaning = meaning
        self.process = process

    def __repr__(self):
        return "ColumnInfo(unit=%r, process=%r)" % (self.unit, self.process)


def parse_reference(text):
    """{file name: {column name: ColumnInfo}} from the text of `volev columns`."""
    reference, section, paragraph, header = {}, None, "", None
    for line in text.splitlines():
        line = line.rstrip()
        if line.startswith("## "):
            section, header, paragraph = line[3:].strip(), None, ""
            reference.setdefault(section, {})
            continue
        if section is None:
            continue
        if not line.startswith("|"):
            if line:
                paragraph, header = line, None
            continue
        head = _HEAD.match(line)
        if head and header is None:
            header = [h.lower() for h in head.groups()]
            continue
        row = _ROW.match(line)
        if not row or header is None:
            continue  # the |---| rule, or a table this reader does not know
        name, second, meaning = row.group(1), row.group(2).strip(), row.group(3).strip()
        if header[1] == "unit":
            info = ColumnInfo(second or None, meaning)
        else:
            stated = _PAREN_UNIT.search(paragraph)
            info = ColumnInfo(stated.group(1).strip() if stated else None, meaning,
                              process=second or None)
        reference[section][name] = info
    return reference


def column_reference(binary=None):
    """The output schema of the volev program binary ($VOLEV_BIN, `volev` on PATH)."""
    return parse_reference(invoke(["columns"], binary).stdout)


def series_units(binary=None):
    """{series.csv column: unit} (None where volev states none, e.g. a dimensionless one)."""
    return {name: info.unit for name, info in column_reference(binary).get("series.csv", {}).items()}
