"""Running the volev program from Python: run, sweep and balance, each followed by the
reader of what it wrote. The program is found from the binary argument, else the
environment variable VOLEV_BIN, else `volev` on PATH. A non-zero exit raises VolevError
carrying volev's own message (its standard error) and the exit code's meaning
(volev(1), "EXIT STATUS")."""

import math
import os
import shutil
import subprocess

from .readers import read_balance, read_run, read_sweep

# volev --help, "exit codes"
EXIT_MEANINGS = {
    1: "internal error",
    2: "bad command line",
    3: "bad scenario or input data",
    4: "integration failed",
    5: "file I/O error, or the output folder is taken",
    6: "external program (gnuplot) missing or failed",
}


class VolevError(Exception):
    """volev exited with an error. Attributes: returncode, stderr (volev's message),
    stdout, command (the argument list)."""

    def __init__(self, command, returncode, stdout, stderr):
        self.command = list(command)
        self.returncode = returncode
        self.stdout = stdout
        self.stderr = stderr
        if returncode < 0:
            meaning = "stopped by signal %d" % -returncode
        else:
            meaning = EXIT_MEANINGS.get(returncode, "exit code %d" % returncode)
        message = stderr.strip() or "(no message)"
        super().__init__("%s failed (exit %d: %s): %s"
                         % (" ".join(command[:2]), returncode, meaning, message))


def find_binary(binary=None):
    """The volev program to run: binary, $VOLEV_BIN or `volev` on PATH."""
    candidate = binary or os.environ.get("VOLEV_BIN") or shutil.which("volev")
    if not candidate:
        raise FileNotFoundError("no volev program: pass binary=..., set VOLEV_BIN, "
                                "or put volev on PATH (make; make install)")
    candidate = os.fspath(candidate)
    if not (os.path.isfile(candidate) and os.access(candidate, os.X_OK)):
        raise FileNotFoundError("volev program %s does not exist or is not executable"
                                % candidate)
    return candidate


def format_value(key, value):
    """The text of one --set value: true/false, integers as written, floats with 17
    significant digits (repr: the same double back), text as given."""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, int):
        return str(value)
    if isinstance(value, float):
        if not math.isfinite(value):
            raise ValueError("override %s=%r: volev takes finite numbers only" % (key, value))
        return repr(value)
    if isinstance(value, str):
        if "\n" in value or "\r" in value:
            raise ValueError("override %s: a value cannot hold a line break" % key)
        return value
    raise TypeError("override %s: %s values are not supported (bool, int, float or str)"
                    % (key, type(value).__name__))


def set_arguments(overrides):
    """['--set', 'KEY=VALUE', ...] for a mapping of scenario keys to values."""
    args = []
    for key, value in (overrides or {}).items():
        if not isinstance(key, str) or not key or "=" in key:
            raise ValueError("override key %r: expected a scenario key such as "
                             "'planet.orbit_au'" % (key,))
        args += ["--set", "%s=%s" % (key, format_value(key, value))]
    return args


def invoke(args, binary=None, cache_dir=None):
    """Runs volev with args; the CompletedProcess (text output) or VolevError.
    cache_dir sets VOLEV_CACHE_DIR, the climate table cache, for this call."""
    command = [find_binary(binary)] + [os.fspath(a) for a in args]
    env = dict(os.environ)
    if cache_dir is not None:
        env["VOLEV_CACHE_DIR"] = os.fspath(cache_dir)
    done = subprocess.run(command, stdout=subprocess.PIPE, stderr=subprocess.PIPE,
                          env=env, text=True, check=False)
    if done.returncode != 0:
        raise VolevError(command, done.returncode, done.stdout, done.stderr)
    return done


def _make_parent(out_dir):
    """Creates the folders above out_dir (volev makes out_dir itself, and only that)."""
    parent = os.path.dirname(os.path.abspath(os.fspath(out_dir)))
    os.makedirs(parent, exist_ok=True)


def run(scenario, out_dir, overrides=None, binary=None, replace=False, cache_dir=None,
        backend="auto"):
    """`volev run SCENARIO -o OUT_DIR --set KEY=VALUE ...`, then read_run(OUT_DIR).

    overrides: {scenario key: value}; replace: pass --replace (write over an earlier
    result in OUT_DIR; without it volev refuses a folder that is not empty)."""
    args = ["run", scenario, "-o", out_dir] + (["--replace"] if replace else [])
    _make_parent(out_dir)
    invoke(args + set_arguments(overrides), binary, cache_dir)
    return read_run(out_dir, backend)


def sweep(scenario, out_dir, threads=None, binary=None, replace=False, cache_dir=None,
          backend="auto"):
    """`volev sweep SCENARIO -o OUT_DIR [-j THREADS] --quiet`, then read_sweep(OUT_DIR)."""
    args = ["sweep", scenario, "-o", out_dir, "--quiet"]
    if threads is not None:
        args += ["-j", str(int(threads))]
    if replace:
        args.append("--replace")
    _make_parent(out_dir)
    invoke(args, binary, cache_dir)
    return read_sweep(out_dir, backend)


def balance(scenario, out_dir, age_yr=None, overrides=None, binary=None, cache_dir=None,
            backend="auto"):
    """`volev balance SCENARIO -o OUT_DIR [--age-yr AGE] --set ...`, then read_balance."""
    args = ["balance", scenario, "-o", out_dir]
    if age_yr is not None:
        args += ["--age-yr", format_value("age_yr", float(age_yr))]
    _make_parent(out_dir)
    invoke(args + set_arguments(overrides), binary, cache_dir)
    return read_balance(out_dir, backend)
