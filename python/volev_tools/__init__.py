"""volev_tools: read volev's outputs into tables and run volev from Python.

Standard library only; pandas is used when importable (tables.py). docs/python.md.

    import volev_tools as vt
    wet = vt.run("scenarios/demo.cfg", "out/wet", overrides={"run.end_yr": 1e9})
    wet.value("final_surface_water_to"), wet.series, wet.meta["summary"]["version"]
"""

from .csvfile import OutputError, parse_comments
from .readers import (RunOutput, SweepOutput, Table, read_balance, read_compare, read_csv,
                      read_run, read_sweep)
from .reference import ColumnInfo, column_reference, parse_reference, series_units
from .runner import VolevError, balance, find_binary, run, sweep
from .tables import column, is_frame, nrows, records

__all__ = [
    "OutputError", "VolevError", "RunOutput", "SweepOutput", "Table", "ColumnInfo",
    "read_run", "read_sweep", "read_balance", "read_compare", "read_csv", "parse_comments",
    "run", "sweep", "balance", "find_binary",
    "column_reference", "parse_reference", "series_units",
    "column", "records", "nrows", "is_frame",
]
