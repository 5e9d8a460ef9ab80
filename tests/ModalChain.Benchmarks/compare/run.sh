#!/usr/bin/env bash
# Benchmark: ModalChain (Release CLI) against the NumPy/SciPy script, side by side; writes the table into docs/performance.md.
# usage: tests/ModalChain.Benchmarks/compare/run.sh [--runs N] [--cases all-500-native,...] [--no-docs]
# Environment: MODALCHAIN_CLI=path/to/modalchain.dll (or a native executable) to measure another build (e.g. an older commit);
# WORK=dir for models and outputs; MODALCHAIN_BUILD=aot (the default: the native ahead-of-time build, which needs clang or gcc
# and zlib1g-dev), r2r (the published ReadyToRun build, run by dotnet) or jit (the plain Release build); MODALCHAIN_NO_R2R=1 is
# the same as MODALCHAIN_BUILD=jit.
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
build="${MODALCHAIN_BUILD:-aot}"
[ -n "${MODALCHAIN_NO_R2R:-}" ] && build=jit
case "$(uname -m)" in aarch64|arm64) rid=linux-arm64 ;; *) rid=linux-x64 ;; esac
# On an x86-64 processor with AVX2 the build targets it (x86-64-v3), as the JIT does on such a machine: the SIMD kernels
# (ComplexKernels) then take the same paths and the outputs match the normal build bit for bit. The default AOT target
# has no AVX, so its sums of the direct sweeps differ in the last digits (4e-12 relative seen).
isa=()
[ "$(uname -m)" = x86_64 ] && grep -qw avx2 /proc/cpuinfo && isa=(-p:IlcInstructionSet=x86-64-v3)
if [ -z "$cli" ]; then
  case "$build" in
    aot)
      # The native ahead-of-time build: machine code for this platform, no JIT and no dotnet host at run time.
      dotnet publish "$repo/src/ModalChain.Cli" -c Release -r "$rid" -p:PublishAot=true "${isa[@]}" -o "$work/aot" -v quiet -nologo >/dev/null
      cli="$work/aot/modalchain" ;;
    r2r)
      # The published ReadyToRun build: precompiled code, less JIT per process.
      dotnet publish "$repo/src/ModalChain.Cli" -c Release -r "$rid" --self-contained false -p:PublishReadyToRun=true \
        -o "$work/bin" -v quiet -nologo >/dev/null
      cli="$work/bin/modalchain.dll" ;;
    jit)
      # The plain Release build (every method compiled by the JIT as it is first called).
      dotnet build -c Release "$repo/src/ModalChain.Cli" -o "$work/jit" -v quiet -nologo >/dev/null
      cli="$work/jit/modalchain.dll" ;;
    *) echo "MODALCHAIN_BUILD must be aot, r2r or jit (got '$build')" >&2; exit 2 ;;
  esac
fi
if [ -n "${MODALCHAIN_CLI:-}" ]; then what="build $cli"; else what="$build build"; fi
label="$(git -C "$repo" rev-parse --short HEAD), $(nproc) cores, $what"
exec /usr/bin/python3 "$here/compare.py" "$cli" "$work" --label "$label" "$@"
