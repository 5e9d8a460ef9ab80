"""Runs ModalChain and the NumPy/SciPy script side by side, interleaved, and writes the table into docs/performance.md.

usage: compare.py CLI_DLL WORK_DIR [--runs N] [--cases a,b,...] [--label TEXT] [--no-docs]
"""
import argparse
import json
import os
import re
import statistics
import subprocess
import sys
from pathlib import Path

import models

HERE = Path(__file__).resolve().parent
REPO = HERE.parents[2]
TIMEOUT = 600

# name: (model file, modalchain arguments, script kind, what)
CASES = {
    "all-500-native": ("random-500.yaml", ["modes", "--solver", "native"], "all", "all modes, random network n = 500, native"),
    "all-500-managed": ("random-500.yaml", ["modes", "--solver", "managed"], "all", "all modes, n = 500, managed"),
    "all-1000-native": ("random-1000.yaml", ["modes", "--solver", "native"], "all", "all modes, n = 1,000, native"),
    "all-1000-managed": ("random-1000.yaml", ["modes", "--solver", "managed"], "all", "all modes, n = 1,000, managed"),
    "all-2000-native": ("random-2000.yaml", ["modes", "--solver", "native"], "all", "all modes, n = 2,000, native"),
    "all-2000-managed": ("random-2000.yaml", ["modes", "--solver", "managed"], "all", "all modes, n = 2,000, managed"),
    "low20-1000": ("random-1000.yaml", ["modes", "--count", "20"], "lowest", "lowest 20 modes, n = 1,000 (auto)"),
    "low20-2000": ("random-2000.yaml", ["modes", "--count", "20"], "lowest", "lowest 20 modes, n = 2,000 (auto)"),
    "low20-grid": ("grid-100x100.yaml", ["modes", "--count", "20"], "lowest", "lowest 20 modes, 100 x 100 grid (auto)"),
    "all-2000-energy": ("random-2000.yaml", ["modes", "--solver", "native", "--detail", "energy"], "all", "all modes, n = 2,000, native, `--detail energy`"),
    "harmonic-500": ("harmonic-500.yaml", ["harmonic"], "harmonic", "modal harmonic sweep, 500 masses x 10,000 frequencies"),
}


def write_models(work):
    files = {
        "random-500.yaml": lambda: models.random_network(500, 500),
        "random-1000.yaml": lambda: models.random_network(1000, 1000),
        "random-2000.yaml": lambda: models.random_network(2000, 2000),
        "grid-100x100.yaml": lambda: models.grid(100, 100),
        "harmonic-500.yaml": lambda: models.harmonic_network(500, 10000, 5),
    }
    for name, make in files.items():
        path = work / name
        if not path.exists():
            path.write_text(make(), encoding="utf-8")


def timed(command, out_path, env=None):
    """Runs command under /usr/bin/time -v with stdout to out_path; returns (seconds, peak MB, stderr, processor seconds) or None on failure."""
    with open(out_path, "wb") as out:
        try:
            p = subprocess.run(["/usr/bin/time", "-v", *command], stdout=out, stderr=subprocess.PIPE, timeout=TIMEOUT, env=env)
        except subprocess.TimeoutExpired:
            return None
    err = p.stderr.decode("utf-8", "replace")
    if p.returncode != 0:
        print(f"  failed ({p.returncode}): {' '.join(command)}\n{err[-2000:]}", file=sys.stderr)
        return None
    wall = re.search(r"Elapsed \(wall clock\) time \(h:mm:ss or m:ss\): (?:(\d+):)?(\d+):([\d.]+)", err)
    seconds = int(wall.group(1) or 0) * 3600 + int(wall.group(2)) * 60 + float(wall.group(3))
    peak = int(re.search(r"Maximum resident set size \(kbytes\): (\d+)", err).group(1)) / 1024
    processor = float(re.search(r"User time \(seconds\): ([\d.]+)", err).group(1)) + float(re.search(r"System time \(seconds\): ([\d.]+)", err).group(1))
    return seconds, peak, err, processor


def frequencies_of_modalchain(path):
    with open(path, encoding="utf-8") as f:
        data = json.load(f)
    return [m["frequency_hz"] for m in data["modes"]] if "modes" in data else None


def agreement(a, b):
    if not a or not b:
        return None
    worst = 0.0
    for x, y in zip(a, b):
        if max(x, y) > 1e-6 * max(b):
            worst = max(worst, abs(x - y) / max(abs(x), abs(y)))
    return worst


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("cli")
    parser.add_argument("work")
    parser.add_argument("--runs", type=int, default=3)
    parser.add_argument("--cases", default=",".join(CASES))
    parser.add_argument("--label", default="this branch")
    parser.add_argument("--no-docs", action="store_true")
    args = parser.parse_args()
    work = Path(args.work)
    # A framework-dependent build is a .dll run by `dotnet`; a native ahead-of-time build is an executable of its own.
    launcher = ["dotnet", args.cli] if args.cli.endswith(".dll") else [args.cli]
    work.mkdir(parents=True, exist_ok=True)
    write_models(work)
    chosen = [c for c in args.cases.split(",") if c]
    if os.environ.get("MODALCHAIN_NO_SOLVER_OPTION") == "1":  # an older build without --solver: its only (managed) solver
        for name, (model, mc_args, kind, what) in list(CASES.items()):
            CASES[name] = (model, [a for i, a in enumerate(mc_args) if a != "--solver" and (i == 0 or mc_args[i - 1] != "--solver")], kind, what)
    times = {c: {"mc": [], "py": [], "mc_mb": [], "py_mb": [], "mc_cpu": [], "py_cpu": []} for c in chosen}
    notes = {}
    for run in range(args.runs):
        for case in chosen:
            model, mc_args, kind, _ = CASES[case]
            mc = timed([*launcher, mc_args[0], str(work / model), *mc_args[1:], "--format", "json"], work / f"{case}.mc.json")
            py = timed(["/usr/bin/python3", str(HERE / "script.py"), kind, str(work / model), str(work / f"{case}.py.json")], work / f"{case}.py.out")
            for key, r in (("mc", mc), ("py", py)):
                if r is None:
                    times[case][key].append(float("nan"))
                    times[case][key + "_mb"].append(float("nan"))
                    times[case][key + "_cpu"].append(float("nan"))
                else:
                    times[case][key].append(r[0])
                    times[case][key + "_mb"].append(r[1])
                    times[case][key + "_cpu"].append(r[3])
            print(f"run {run + 1} {case}: modalchain {times[case]['mc'][-1]:.2f} s ({times[case]['mc_cpu'][-1]:.2f} s processor), "
                  f"script {times[case]['py'][-1]:.2f} s ({times[case]['py_cpu'][-1]:.2f} s processor), load {os.getloadavg()[0]:.0f}", file=sys.stderr, flush=True)
            if run == 0 and mc and py and kind != "harmonic":
                with open(work / f"{case}.py.json", encoding="utf-8") as f:
                    reference = json.load(f)["frequencies_hz"]
                notes[case] = agreement(frequencies_of_modalchain(work / f"{case}.mc.json"), reference)

    # The eigen step alone: ModalChain's stage timer against SciPy's eigh (dsygvd) on the same matrices, once each.
    eigen = {}
    for case in chosen:
        model, mc_args, kind, _ = CASES[case]
        if mc_args[0] != "modes" or kind != "all":
            continue
        env = dict(os.environ, MODALCHAIN_STAGE_TIMES="1")
        mc = timed([*launcher, mc_args[0], str(work / model), *mc_args[1:], "--format", "json"], work / f"{case}.stages.json", env)
        py = timed(["/usr/bin/python3", str(HERE / "script.py"), kind, str(work / model), str(work / f"{case}.py.json")], work / f"{case}.py.out")
        if mc and py:
            m = re.search(r"stage: eigen solve \(extra, timing only\): ([\d.]+) s \(processor ([\d.]+) s\)", mc[2])
            p = re.search(r"stage: eigen solve: ([\d.]+) s \(processor ([\d.]+) s\)", py[2])
            if m and p:
                eigen[case] = (float(m.group(1)), float(p.group(1)), float(m.group(2)), float(p.group(2)))
            print(f"stages {case}:\n" + "\n".join(l for l in mc[2].splitlines() if l.startswith("stage:")), file=sys.stderr)

    def med(values):
        finite = [v for v in values if v == v]
        return statistics.median(finite) if len(finite) == len(values) and finite else float("nan")

    rows = ["| work | ModalChain | the script | ratio (ModalChain / script) | processor time, ModalChain / script | frequencies agree to |",
            "|---|---|---|---|---|---|"]
    for case in chosen:
        t = times[case]
        mc, py = med(t["mc"]), med(t["py"])
        mc_mb, py_mb = med(t["mc_mb"]), med(t["py_mb"])
        mc_cpu, py_cpu = med(t["mc_cpu"]), med(t["py_cpu"])
        ratio = mc / py if mc == mc and py == py else float("nan")
        cpu_ratio = mc_cpu / py_cpu if mc_cpu == mc_cpu and py_cpu == py_cpu and py_cpu > 0 else float("nan")
        agree = notes.get(case)
        rows.append(f"| {CASES[case][3]} | {fmt(mc)} s, {fmt(mc_mb, 0)} MB | {fmt(py)} s, {fmt(py_mb, 0)} MB | {fmt(ratio, 2)}× | "
                    f"{fmt(mc_cpu)} s / {fmt(py_cpu)} s = {fmt(cpu_ratio, 2)}× | {'—' if agree is None else f'{agree:.0e}'} |")
    if eigen:
        rows += ["", "| eigen step alone (wall; processor) | ModalChain | SciPy eigh (dsygvd) | ratio (wall; processor) |", "|---|---|---|---|"]
        for case, (m, p, mp, pp) in eigen.items():
            rows.append(f"| {CASES[case][3]} | {m:.2f} s; {mp:.2f} s | {p:.2f} s; {pp:.2f} s | {m / p:.2f}×; {mp / pp:.2f}× |")
    table = "\n".join(rows)
    print(table)
    if not args.no_docs:
        update_docs(table, args.label, args.runs)


def fmt(value, digits=2):
    return "n/a" if value != value else f"{value:.{digits}f}"


def update_docs(table, label, runs):
    path = REPO / "docs" / "performance.md"
    text = path.read_text(encoding="utf-8")
    begin, end = "<!-- compare:begin -->", "<!-- compare:end -->"
    block = (f"{begin}\nSide by side with the NumPy/SciPy script ({label}; medians of {runs} interleaved runs, wall clock, processor "
             f"time (user + system, every thread) and peak resident memory from `/usr/bin/time -v`, end to end from process start "
             f"to JSON written):\n\n{table}\n{end}")
    if begin in text:
        text = text[:text.index(begin)] + block + text[text.index(end) + len(end):]
    else:
        text = text.rstrip() + "\n\n" + block + "\n"
    path.write_text(text, encoding="utf-8")


if __name__ == "__main__":
    main()
