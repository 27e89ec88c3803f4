"""Shared set-up of the volev_tools tests: where the repository and the program are, the
backends to test, and independent readings of a CSV file's text (plain line splitting,
no volev_tools code) to compare the tables against."""

import importlib.util
import os
import sys
import unittest

TOP = os.environ.get("VOLEV_TOP") or os.path.abspath(
    os.path.join(os.path.dirname(__file__), "..", ".."))
sys.path.insert(0, os.path.join(TOP, "python"))

BIN = os.environ.get("VOLEV_BIN") or os.path.join(TOP, "build", "volev")
HAVE_PANDAS = importlib.util.find_spec("pandas") is not None

# Every test class runs once per backend: the plain column lists always, pandas when
# importable (CI installs python3-pandas: scripts/deps.sh --hardening).
BACKENDS = ["columns"] + (["pandas"] if HAVE_PANDAS else [])


def need_binary(test_case):
    if not os.access(BIN, os.X_OK):
        raise unittest.SkipTest("no volev program at %s (make, or set VOLEV_BIN)" % BIN)


def data_lines(path):
    """The lines of a volev CSV after its header: every line that is not blank and not
    a '#' comment, less the first such (the header)."""
    with open(path, encoding="utf-8") as f:
        lines = [l.rstrip("\n") for l in f if l.strip() and not l.startswith("#")]
    return lines[1:]


def header_line(path):
    with open(path, encoding="utf-8") as f:
        return next(l.rstrip("\n") for l in f if l.strip() and not l.startswith("#"))


def first_line(path):
    with open(path, encoding="utf-8") as f:
        return f.readline().rstrip("\n")


def summary_text(path, name):
    """The value field of summary.csv's row `name`, as text."""
    for line in data_lines(path):
        fields = line.split(",")
        if fields[0] == name:
            return fields[1]
    raise AssertionError("%s has no row %s" % (path, name))


def is_missing(value):
    """None (column lists) or NaN (a DataFrame's numeric column)."""
    return value is None or (isinstance(value, float) and value != value)
