#!/usr/bin/env bash
# Benchmark: ModalChain (Release CLI) against the NumPy/SciPy script, side by side; writes the table into docs/performance.md.
# usage: tests/ModalChain.Benchmarks/compare/run.sh [--runs N] [--cases all-500-native,...] [--no-docs]
# Environment: MODALCHAIN_CLI=path/to/modalchain.dll to measure another build (e.g. an older commit); WORK=dir for models and outputs;
# MODALCHAIN_NO_R2R=1 to measure the plain Release build instead of the published ReadyToRun one.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
repo="$(cd "$here/../../.." && pwd)"
work="${WORK:-/tmp/modalchain-compare}"

# The script's side and the native solver's library come from Debian (PyPI is never used); a benchmark dependency only.
need=()
/usr/bin/python3 -c 'import numpy, scipy, yaml' 2>/dev/null || need+=(python3-numpy python3-scipy python3-yaml)
[ -x /usr/bin/time ] || need+=(time)
ldconfig -p 2>/dev/null | grep -q libopenblas.so.0 || need+=(libopenblas0-pthread)
if [ ${#need[@]} -gt 0 ]; then
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${need[@]}" >/dev/null
fi

cli="${MODALCHAIN_CLI:-}"
if [ -z "$cli" ]; then
  if [ -n "${MODALCHAIN_NO_R2R:-}" ]; then
    # The plain Release build (every method compiled by the JIT as it is first called).
    dotnet build -c Release "$repo/src/ModalChain.Cli" -o "$work/bin" -v quiet -nologo >/dev/null
  else
    # The published ReadyToRun build, as docs/performance.md recommends installing it: precompiled code, less JIT per process.
    case "$(uname -m)" in aarch64|arm64) rid=linux-arm64 ;; *) rid=linux-x64 ;; esac
    dotnet publish "$repo/src/ModalChain.Cli" -c Release -r "$rid" --self-contained false -p:PublishReadyToRun=true \
      -o "$work/bin" -v quiet -nologo >/dev/null
  fi
  cli="$work/bin/modalchain.dll"
fi
label="$(git -C "$repo" rev-parse --short HEAD), $(nproc) cores"
exec /usr/bin/python3 "$here/compare.py" "$cli" "$work" --label "$label" "$@"
