#!/usr/bin/env python3
# Interleaved A/B of whole commands: ROUNDS rounds of every variant in turn; medians and minima of processor time (user + system, all threads) and wall clock.
# usage: interleave.py ROUNDS "label=[ENV=value ...] command args..." ...   (the load average printed is the one at the end)
import sys, subprocess, statistics, os, shlex, time, resource
rounds = int(sys.argv[1]); variants = sys.argv[2:]
res = {v: [] for v in variants}
for r in range(rounds):
    for v in variants:
        label, cmd = v.split('=', 1)
        env = dict(os.environ)
        parts = shlex.split(cmd)
        while parts and '=' in parts[0] and not parts[0].startswith('/'):
            k, val = parts.pop(0).split('=', 1); env[k] = val
        before = resource.getrusage(resource.RUSAGE_CHILDREN)
        t0 = time.time()
        p = subprocess.run(parts, env=env, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
        wall = time.time() - t0
        after = resource.getrusage(resource.RUSAGE_CHILDREN)
        cpu = (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)
        res[v].append((cpu, wall, p.returncode))
load = os.getloadavg()[0]
for v in variants:
    cpus = [c for c, w, rc in res[v]]; walls = [w for c, w, rc in res[v]]
    print(f"{v.split('=',1)[0]:>12}: processor median {statistics.median(cpus):.3f} s min {min(cpus):.3f}; wall median {statistics.median(walls):.3f} min {min(walls):.3f}; rc {set(rc for _,_,rc in res[v])}  (load {load:.1f})")
