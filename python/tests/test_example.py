"""The example script of docs/python.md runs as printed, and what it prints is what the
run folders hold (summary.csv's values, events.csv's rows)."""

import os
import re
import shutil
import subprocess
import sys
import tempfile
import unittest

import support
from support import BIN, TOP, data_lines, summary_text


def example_code():
    """The first ```python block after docs/python.md's "## Example" heading."""
    with open(os.path.join(TOP, "docs", "python.md"), encoding="utf-8") as f:
        text = f.read()
    section = text[text.index("\n## Example"):]
    match = re.search(r"```python\n(.*?)```", section, re.S)
    if not match:
        raise AssertionError("docs/python.md: no python block in its Example section")
    return match.group(1)


class Example(unittest.TestCase):
    def setUp(self):
        support.need_binary(self)
        self.dir = tempfile.mkdtemp(prefix="volev-tools-example-")
        self.addCleanup(shutil.rmtree, self.dir, True)

    def test_runs_and_prints_the_folders_values(self):
        script = os.path.join(self.dir, "example.py")
        with open(script, "w", encoding="utf-8") as f:
            f.write(example_code())
        out = os.path.join(self.dir, "out")
        env = dict(os.environ, VOLEV_TOP=TOP, VOLEV_BIN=BIN)
        done = subprocess.run([sys.executable, "-B", script, out], cwd=self.dir, env=env,
                              stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True)
        self.assertEqual(done.returncode, 0, done.stderr)
        for name in ("wet", "dry"):
            summary = os.path.join(out, name, "summary.csv")
            water = "%.4g" % float(summary_text(summary, "final_surface_water_to"))
            o2 = "%.4g" % float(summary_text(summary, "final_o2"))
            line = next(l for l in done.stdout.splitlines() if l.startswith(name + ":"))
            self.assertIn("surface water %s TO" % water, line)
            self.assertIn("O2 %s bar" % o2, line)
            events = [l for l in done.stdout.splitlines() if l.startswith(name + "  ")]
            self.assertEqual(len(events), len(data_lines(os.path.join(out, name, "events.csv"))))
        # the dry start has no D/H of its water (docs/columns.md): printed as none
        self.assertIn("D/H none", next(l for l in done.stdout.splitlines() if l.startswith("dry:")))


if __name__ == "__main__":
    unittest.main()
