"""The table a reader hands back: a pandas DataFrame, or plain column lists.

backend="auto" (the default) gives a DataFrame when pandas can be imported and the
environment variable VOLEV_TOOLS_NO_PANDAS is not set to a non-empty value other than
"0"; otherwise a dict mapping each column name (in file order) to a list of values.
backend="pandas" insists on pandas; backend="columns" never uses it.

Empty fields ("no value"): None in the column lists; in a DataFrame, NaN in a numeric
column and None in a text column. A DataFrame carries the file's metadata in
df.attrs["meta"] too.
"""

import importlib
import os

BACKENDS = ("auto", "pandas", "columns")


def pandas_disabled():
    """Whether VOLEV_TOOLS_NO_PANDAS asks for the plain column lists."""
    flag = os.environ.get("VOLEV_TOOLS_NO_PANDAS", "")
    return flag not in ("", "0")


def _import_pandas():
    try:
        return importlib.import_module("pandas")
    except ImportError:
        return None


def resolve_backend(backend):
    """The pandas module to use, or None for the column lists."""
    if backend not in BACKENDS:
        raise ValueError("backend must be one of %s, not %r" % (", ".join(BACKENDS), backend))
    if backend == "columns":
        return None
    if backend == "auto":
        return None if pandas_disabled() else _import_pandas()
    pandas = _import_pandas()
    if pandas is None:
        raise ImportError("backend='pandas' but pandas cannot be imported "
                          "(Debian: apt-get install python3-pandas)")
    return pandas


def make_table(raw, backend="auto"):
    """A RawTable (csvfile.py) as a DataFrame or a dict of column lists."""
    pandas = resolve_backend(backend)
    if pandas is None:
        return {name: list(raw.columns[name]) for name in raw.header}
    data = {}
    for name in raw.header:
        values, kind = raw.columns[name], raw.kinds[name]
        if kind in ("text", "mixed"):
            dtype = object
        elif kind == "int" and None not in values:
            dtype = "int64"
        else:
            dtype = "float64"  # None becomes NaN
        data[name] = pandas.Series(values, dtype=dtype)
    frame = pandas.DataFrame(data, columns=list(raw.header))
    frame.attrs["meta"] = raw.meta
    return frame


def is_frame(table):
    """Whether table is a DataFrame (rather than a dict of column lists)."""
    return not isinstance(table, dict)


def column(table, name):
    """One column as a plain list (NaN of a DataFrame's numeric column as None)."""
    if not is_frame(table):
        return list(table[name])
    values = table[name].tolist()
    return [None if isinstance(v, float) and v != v else v for v in values]


def nrows(table):
    if is_frame(table):
        return len(table.index)
    return len(next(iter(table.values()))) if table else 0


def records(table):
    """The rows as dicts (column name -> value, None for an empty field), in file order."""
    names = list(table.columns) if is_frame(table) else list(table)
    cols = [column(table, name) for name in names]
    return [dict(zip(names, row)) for row in zip(*cols)]
