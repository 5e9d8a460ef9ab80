#!/usr/bin/env python3
# Numeric difference of two JSON outputs (tool_version ignored): how many numbers differ and the worst relative difference.
# usage: jsondiff.py before.json after.json
import json, sys
a = json.load(open(sys.argv[1])); b = json.load(open(sys.argv[2]))
worst = [0.0, None, None, None]; count = [0]; other = []
def walk(x, y, path):
    if isinstance(x, dict):
        if set(x) != set(y): other.append(path + ' keys'); return
        for k in x:
            if k == 'tool_version': continue
            walk(x[k], y[k], path + '.' + k)
    elif isinstance(x, list):
        if len(x) != len(y): other.append(path + ' len'); return
        for i, (u, v) in enumerate(zip(x, y)): walk(u, v, f"{path}[{i}]")
    elif isinstance(x, float) or isinstance(y, float):
        if x != y:
            count[0] += 1
            d = abs(x - y) / max(abs(x), abs(y), 1e-300)
            if d > worst[0]: worst[:] = [d, path, x, y]
    elif x != y: other.append(f"{path}: {x!r} != {y!r}")
walk(a, b, '')
print(f"numbers differing: {count[0]}, worst relative {worst[0]:.3g} at {worst[1]} ({worst[2]} vs {worst[3]}); other: {other[:5]}")
