"""Runs every command on every model with two builds of modalchain and compares what they write, byte for byte.

usage: parity.py AOT_EXECUTABLE NORMAL_DLL WORK_DIR [--models DIR] [--pdf]

Each command runs with each format its --help lists (read from the normal build). Compared: exit code, stdout and stderr;
for `report`, the list of files written and results.json byte for byte (its generation time blanked), and report.html
and the SVG figures too
(reported separately, since a report may carry what differs between builds legitimately). Prints one line per difference
and a summary; exit code 1 when any command's output differs.
"""
import argparse
import filecmp
import os
import re
import shutil
import subprocess
import sys
from pathlib import Path

import yaml

HERE = Path(__file__).resolve().parent
REPO = HERE.parents[2]
COMMANDS = ["validate", "modes", "check", "tune", "study", "harmonic", "transient", "report"]


def formats(normal, command):
    out = subprocess.run(normal + [command, "--help"], capture_output=True, text=True).stdout
    m = re.search(r"--format <([a-z|]+)>", out)
    return m.group(1).split("|") if m else [None]


def first_mass(model):
    try:
        data = yaml.safe_load(model.read_text(encoding="utf-8"))
        masses = data.get("masses") or {}
        return next(iter(masses)) if masses else None
    except Exception:
        return None


def stamped(path):
    """The bytes of a results.json with its generation time blanked: two runs a second apart differ only there."""
    return re.sub(rb'"generated_utc": "[^"]*"', b'"generated_utc": ""', path.read_bytes())


def run(command, cwd):
    p = subprocess.run(command, capture_output=True, cwd=cwd, timeout=900)
    return p.returncode, p.stdout, p.stderr


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("aot")
    ap.add_argument("normal")
    ap.add_argument("work")
    ap.add_argument("--models", default=str(REPO / "models"))
    ap.add_argument("--pdf", action="store_true", help="also `report --format pdf` (file lists and results.json)")
    args = ap.parse_args()
    work = Path(args.work)
    builds = {"aot": [str(Path(args.aot).resolve())], "normal": ["dotnet", str(Path(args.normal).resolve())]}
    models_dir = Path(args.models).resolve()
    models = sorted(models_dir.glob("*.yaml"))
    runs = same = 0
    differences = []
    report_notes = []
    for command in COMMANDS:
        for fmt in formats(builds["normal"], command):
            if command == "report" and fmt == "pdf" and not args.pdf:
                continue
            for model in models:
                extra = []
                if command == "tune":
                    host = first_mass(model)
                    extra = ["--host", host] if host else []
                if fmt:
                    extra += ["--format", fmt]
                results = {}
                for name, build in builds.items():
                    kept = None
                    line = build + [command, str(model)] + extra
                    if command == "report":
                        # Both builds write to the same folder (its path may be printed), moved aside after each run.
                        out_dir = work / "report"
                        kept = work / name / f"{model.stem}-{fmt}"
                        shutil.rmtree(out_dir, ignore_errors=True)
                        shutil.rmtree(kept, ignore_errors=True)
                        kept.parent.mkdir(parents=True, exist_ok=True)
                        line += ["--output", str(out_dir)]
                    # Both run from the models folder, so paths printed relative to it agree.
                    results[name] = (run(line, models_dir), kept)
                    if kept is not None and out_dir.exists():
                        out_dir.rename(kept)
                runs += 1
                what = f"{command} {model.name}" + (f" --format {fmt}" if fmt else "")
                (a_code, a_out, a_err), a_dir = results["aot"]
                (n_code, n_out, n_err), n_dir = results["normal"]
                problems = []
                if a_code != n_code:
                    problems.append(f"exit code {a_code} (AOT) vs {n_code} (normal)")
                if a_out != n_out:
                    problems.append(f"stdout differs ({len(a_out)} vs {len(n_out)} bytes)")
                if a_err != n_err:
                    problems.append(f"stderr differs ({len(a_err)} vs {len(n_err)} bytes)")
                if command == "report" and a_code == 0 and n_code == 0 and a_dir.exists() and n_dir.exists():
                    a_files = sorted(str(p.relative_to(a_dir)) for p in a_dir.rglob("*") if p.is_file())
                    n_files = sorted(str(p.relative_to(n_dir)) for p in n_dir.rglob("*") if p.is_file())
                    if a_files != n_files:
                        problems.append(f"files written differ: {sorted(set(a_files) ^ set(n_files))}")
                    elif "results.json" not in a_files:
                        problems.append("no results.json")
                    else:
                        if stamped(a_dir / "results.json") != stamped(n_dir / "results.json"):
                            problems.append("results.json differs")
                        other = [f for f in a_files if f != "results.json" and not f.endswith(".pdf")
                                 and not filecmp.cmp(a_dir / f, n_dir / f, shallow=False)]
                        if other:
                            report_notes.append(f"{what}: {len(other)} of {len(a_files)} files differ: {', '.join(other[:5])}")
                if problems:
                    differences.append(f"{what}: " + "; ".join(problems))
                else:
                    same += 1
                print(f"{'same' if not problems else 'DIFF'} (exit {n_code}) {what}", flush=True)
    print()
    for d in differences:
        print("difference:", d)
    for n in report_notes:
        print("report file note:", n)
    print(f"{same} of {runs} runs identical (exit code, stdout, stderr; reports: file list and results.json) on {len(models)} models")
    return 1 if differences else 0


if __name__ == "__main__":
    sys.exit(main())
