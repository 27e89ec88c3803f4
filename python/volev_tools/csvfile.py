"""One CSV file as volev writes it, read into typed columns and header metadata.

The layout (docs/columns.md, docs/hardening.md "Outputs"): '#' comment lines (those above
the header carry the provenance: volev version, git revision, hashes, code meanings),
one header line, then one row per line with exactly as many fields as the header. Text
fields holding a comma or a quote are quoted the usual CSV way (members.csv), except the
last column of events.csv, free text that runs to the end of the line. An empty field
means "no value": it is read as None. volev never writes nan, inf or -0, and it writes
every file whole (renamed into place when complete), so a file that does not end with a
line end was cut short by something else, and is refused.

Typing, per column: when every non-empty field of a column is a decimal number the
column holds numbers (int when every one is an integer literal, else float); otherwise
it holds the text as written (a spreadsheet-neutralised text field keeps its leading
single quote). A column with no value at all is numeric (all None).
"""

import csv
import os
import re

_NUMBER = re.compile(r"[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?\Z")
_INTEGER = re.compile(r"[+-]?\d+\Z")


class OutputError(Exception):
    """A volev output that is missing, truncated or not what it should be.

    Attributes: path (the file or folder), line (1-based, or None)."""

    def __init__(self, path, message, line=None):
        self.path = str(path)
        self.line = line
        where = "%s:%d" % (self.path, line) if line else self.path
        super().__init__("%s: %s" % (where, message))


class RawTable:
    """A file's content before any table library: header, typed columns, metadata.

    columns maps each header name, in file order, to a list with one value per row
    (int, float, str or None); kinds maps it to "int", "float" or "text"."""

    def __init__(self, path, header, columns, kinds, meta):
        self.path = path
        self.header = header
        self.columns = columns
        self.kinds = kinds
        self.meta = meta

    @property
    def nrows(self):
        return len(self.columns[self.header[0]]) if self.header else 0


# ---------------------------------------------------------------- header metadata

_VERSION = re.compile(r"volev (\S+) \(git ([^)]*)\)(?::\s*(.*))?\Z")
_SCENARIO_HASH = re.compile(r"resolved scenario hash \([^)]*\):\s*([0-9a-fA-F]+)\Z")
_SWEEP_HASH = re.compile(r"sweep hash ([0-9a-fA-F]+) of (.*): (\S+), (\d+) members?\Z")
_AXIS = re.compile(r"axis (\S+)\s+(.*)\Z")
_KEY_VALUE = re.compile(r"([^:]{1,80}?):\s+(.*)\Z")


def parse_comments(comments):
    """The metadata of a file's '#' lines (text after '#', stripped), as a dict.

    Always: "comments" (every line, in order). Where present: "version" and
    "git_revision" (the "volev VERSION (git REV)" line) and "title" (text after it),
    "scenario_hash", "sweep_hash" with "scenario", "design" and "members", "axes" (a
    list of {"key", "spec"} from members.csv's axis lines), and one entry per other
    "KEY: VALUE" line (the first of a repeated key wins; the line stays in comments)."""
    meta = {"comments": list(comments)}
    for text in comments:
        m = _VERSION.match(text)
        if m and "version" not in meta:
            meta["version"], meta["git_revision"] = m.group(1), m.group(2)
            if m.group(3):
                meta["title"] = m.group(3)
            continue
        m = _SCENARIO_HASH.match(text)
        if m:
            meta.setdefault("scenario_hash", m.group(1))
            continue
        m = _SWEEP_HASH.match(text)
        if m:
            meta.setdefault("sweep_hash", m.group(1))
            meta.setdefault("scenario", m.group(2))
            meta.setdefault("design", m.group(3))
            meta.setdefault("members", int(m.group(4)))
            continue
        m = _AXIS.match(text)
        if m:
            meta.setdefault("axes", []).append({"key": m.group(1), "spec": m.group(2)})
            continue
        m = _KEY_VALUE.match(text)
        if m:
            meta.setdefault(m.group(1).strip(), m.group(2).strip())
    return meta


# ---------------------------------------------------------------- lines and fields

def _read_lines(path):
    """The file's lines without their line ends; OutputError if missing or truncated."""
    try:
        with open(path, "r", encoding="utf-8", newline="") as f:
            text = f.read()
    except FileNotFoundError:
        raise OutputError(path, "no such file") from None
    except IsADirectoryError:
        raise OutputError(path, "is a folder, not a CSV file") from None
    except UnicodeDecodeError as e:
        raise OutputError(path, "not UTF-8 text (byte %d): not a volev output" % e.start) from None
    except OSError as e:
        raise OutputError(path, "cannot be read: %s" % e.strerror) from None
    if not text:
        raise OutputError(path, "empty file (truncated, or not a volev output)")
    if not text.endswith("\n"):
        nlines = text.count("\n") + 1
        raise OutputError(path, "truncated: the last line has no line end", nlines)
    lines = text[:-1].split("\n")
    return [line[:-1] if line.endswith("\r") else line for line in lines]


def _split(line, nfields, rest):
    """The fields of one line: quoted CSV, or (rest) plain fields whose last one takes
    the rest of the line, commas included."""
    if rest:
        return line.split(",", nfields - 1) if nfields > 0 else [line]
    return next(csv.reader([line], strict=True))


def _typed(values):
    """(kind, values): the column's fields as numbers when all non-empty ones are; a
    column that holds both ("mixed": a run's value column of compare.csv, where the final
    regime is a name) keeps each number as a float and each word as text."""
    present = [v for v in values if v != ""]
    numeric = [bool(_NUMBER.match(v)) for v in present]
    if all(numeric):
        if all(_INTEGER.match(v) for v in present):
            return "int", [int(v) if v != "" else None for v in values]
        return "float", [float(v) if v != "" else None for v in values]
    if any(numeric):
        return "mixed", [None if v == "" else float(v) if _NUMBER.match(v) else v
                         for v in values]
    return "text", [v if v != "" else None for v in values]


def read_raw(path, expect=(), what="volev output", rest=False):
    """Reads path into a RawTable.

    expect: the names the header must start with (a wrong file is refused before any
    row is read); what: the file's kind in messages; rest: the last column takes the
    rest of the line (events.csv)."""
    path = os.fspath(path)
    lines = _read_lines(path)
    comments, header, rows = [], None, []
    for number, line in enumerate(lines, start=1):
        if not line.strip():
            continue
        if line.lstrip().startswith("#"):
            comments.append(line.lstrip()[1:].strip())
            continue
        try:
            fields = _split(line, len(header) if header else 0, rest and header is not None)
        except csv.Error as e:
            raise OutputError(path, "bad CSV line: %s" % e, number) from None
        if header is None:
            header = fields
            _check_header(path, number, header, expect, what)
            continue
        if len(fields) != len(header):
            raise OutputError(path, "%d fields where the header has %d (a damaged file?)"
                              % (len(fields), len(header)), number)
        rows.append(fields)
    if header is None:
        raise OutputError(path, "no header line, only comments (truncated, or not a %s)" % what)
    columns, kinds = {}, {}
    for k, name in enumerate(header):
        kinds[name], columns[name] = _typed([row[k] for row in rows])
    return RawTable(path, header, columns, kinds, parse_comments(comments))


def _check_header(path, number, header, expect, what):
    if len(set(header)) != len(header):
        raise OutputError(path, "header names a column twice: %s" % ",".join(header), number)
    if list(header[:len(expect)]) != list(expect):
        raise OutputError(path, "not a %s: header starts '%s', expected '%s'"
                          % (what, ",".join(header[:len(expect)]), ",".join(expect)), number)
