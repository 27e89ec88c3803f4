"""Readers of the folders and files volev writes (volev(1), docs/columns.md,
docs/ensembles.md): a run folder, a sweep folder, balance.csv and compare.csv.

Every table is a DataFrame or a dict of column lists (tables.py: backend); every reader
keeps the metadata of each file's '#' lines (csvfile.parse_comments). A missing or
truncated file, or one that is not the expected kind, raises csvfile.OutputError naming
the file (and the line).
"""

import os

from .csvfile import OutputError, read_raw
from .tables import make_table


class Table:
    """One file read: data (the table), meta (its header metadata), path."""

    def __init__(self, raw, backend):
        self.path = raw.path
        self.meta = raw.meta
        self.data = make_table(raw, backend)

    def __repr__(self):
        return "Table(%r)" % self.path


def _folder(folder, what):
    folder = os.fspath(folder)
    if not os.path.exists(folder):
        raise OutputError(folder, "no such %s folder" % what)
    if not os.path.isdir(folder):
        raise OutputError(folder, "not a folder (a %s folder was expected)" % what)
    return folder


def _optional(path):
    return path if os.path.exists(path) else None


def _file_or_folder(path, name):
    """path itself, or path/name when path is a folder."""
    path = os.fspath(path)
    return os.path.join(path, name) if os.path.isdir(path) else path


# ---------------------------------------------------------------- one run

class RunOutput:
    """A `volev run` folder.

    series, events, summary: the tables of series.csv, events.csv and summary.csv;
    meta: {"series": ..., "events": ..., "summary": ...}, each file's header metadata;
    scenario_path: scenario.resolved.cfg (the run's every parameter), None if absent."""

    def __init__(self, folder, backend="auto"):
        folder = _folder(folder, "run")
        self.folder = folder
        raws = {
            "series": read_raw(os.path.join(folder, "series.csv"), ("time_yr",), "volev run series"),
            "events": read_raw(os.path.join(folder, "events.csv"), ("time_yr", "event", "detail"),
                               "volev run event list", rest=True),
            "summary": read_raw(os.path.join(folder, "summary.csv"), ("name", "value", "unit"),
                                "volev run summary"),
        }
        summary = raws["summary"]
        names = summary.columns["name"]
        if len(set(names)) != len(names):
            raise OutputError(summary.path, "a summary row name appears twice")
        self._summary = {name: (value, unit) for name, value, unit in
                         zip(names, summary.columns["value"], summary.columns["unit"])}
        self.meta = {key: raw.meta for key, raw in raws.items()}
        self.series = make_table(raws["series"], backend)
        self.events = make_table(raws["events"], backend)
        self.summary = make_table(summary, backend)
        self.scenario_path = _optional(os.path.join(folder, "scenario.resolved.cfg"))

    @property
    def version(self):
        """The volev version that wrote the run (summary.csv's first line)."""
        return self.meta["summary"].get("version")

    def value(self, name):
        """A summary row's value (a number, or None when the field is empty)."""
        return self._summary_row(name)[0]

    def unit(self, name):
        """A summary row's unit, as written in summary.csv."""
        return self._summary_row(name)[1]

    def summary_names(self):
        return list(self._summary)

    def _summary_row(self, name):
        try:
            return self._summary[name]
        except KeyError:
            raise KeyError("%s has no summary row %r (volev columns lists them)"
                           % (os.path.join(self.folder, "summary.csv"), name)) from None

    def __repr__(self):
        return "RunOutput(%r)" % self.folder


def read_run(folder, backend="auto"):
    """The run folder `volev run -o FOLDER` wrote, as a RunOutput."""
    return RunOutput(folder, backend)


# ---------------------------------------------------------------- a sweep

class SweepOutput:
    """A `volev sweep` folder (docs/ensembles.md, "Output files").

    members, ensemble_summary, ensemble_series: their tables; sensitivity: the table of
    sensitivity.csv, None unless the design was saltelli; meta: each file's header
    metadata by the same names (members' includes "sweep_hash", "design", "members"
    and "axes"); axes: the axis keys, the override columns of members."""

    def __init__(self, folder, backend="auto"):
        folder = _folder(folder, "sweep")
        self.folder = folder
        expect = {
            "members": ("member",),
            "ensemble_summary": ("kind", "name", "unit"),
            "ensemble_series": ("time_yr", "members"),
            "sensitivity": ("outcome", "parameter"),
        }
        raws = {}
        for name, head in expect.items():
            path = os.path.join(folder, name + ".csv")
            if name == "sensitivity" and not os.path.exists(path):
                continue
            raws[name] = read_raw(path, head, "volev sweep %s file" % name.replace("_", " "))
        self.meta = {key: raw.meta for key, raw in raws.items()}
        self.members = make_table(raws["members"], backend)
        self.ensemble_summary = make_table(raws["ensemble_summary"], backend)
        self.ensemble_series = make_table(raws["ensemble_series"], backend)
        self.sensitivity = make_table(raws["sensitivity"], backend) if "sensitivity" in raws else None
        self.axes = [axis["key"] for axis in self.meta["members"].get("axes", [])]
        self.scenario_path = _optional(os.path.join(folder, "scenario.resolved.cfg"))

    @property
    def version(self):
        return self.meta["members"].get("version")

    def __repr__(self):
        return "SweepOutput(%r)" % self.folder


def read_sweep(folder, backend="auto"):
    """The folder `volev sweep -o FOLDER` wrote, as a SweepOutput."""
    return SweepOutput(folder, backend)


# ---------------------------------------------------------------- balance, compare

def read_balance(path, backend="auto"):
    """balance.csv (or the folder `volev balance -o FOLDER` wrote) as a Table: one row
    per surface temperature; meta holds the age, the atmosphere and the equilibria."""
    raw = read_raw(_file_or_folder(path, "balance.csv"), ("surface_temp_k",),
                   "volev balance table")
    return Table(raw, backend)


def read_compare(path, backend="auto"):
    """compare.csv (or the folder `volev compare -o FOLDER` wrote) as a Table: one row
    per quantity; meta holds which run each value column is."""
    raw = read_raw(_file_or_folder(path, "compare.csv"), ("quantity",),
                   "volev comparison table")
    return Table(raw, backend)


def read_csv(path, backend="auto"):
    """Any CSV file volev wrote, with no expectation on its header, as a Table."""
    return Table(read_raw(path), backend)
