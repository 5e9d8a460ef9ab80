#!/usr/bin/env bash
# Publishes the native ahead-of-time (AOT) build and the normal Release build, runs every command on every models/*.yaml
# with both and compares what they write byte for byte (tests/ModalChain.Benchmarks/aot/parity.py). Not a benchmark.
# usage: tests/ModalChain.Benchmarks/aot/parity.sh [--pdf]
# Environment: WORK=dir for the builds and outputs (default /tmp/modalchain-aot-parity); MODALCHAIN_AOT=path to an
# already published AOT executable (skips the publish). The AOT publish needs clang (or gcc) and zlib1g-dev on Linux.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
repo="$(cd "$here/../../.." && pwd)"
work="${WORK:-/tmp/modalchain-aot-parity}"
mkdir -p "$work"
/usr/bin/python3 -c 'import yaml' 2>/dev/null || {
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq python3-yaml >/dev/null
}
case "$(uname -m)" in aarch64|arm64) rid=linux-arm64 ;; *) rid=linux-x64 ;; esac
# On an x86-64 processor with AVX2 the build targets it (x86-64-v3), as the JIT does on such a machine: the SIMD kernels
# (ComplexKernels) then take the same paths and the outputs match the normal build bit for bit. The default AOT target
# has no AVX, so its sums of the direct sweeps differ in the last digits (4e-12 relative seen).
isa=()
[ "$(uname -m)" = x86_64 ] && grep -qw avx2 /proc/cpuinfo && isa=(-p:IlcInstructionSet=x86-64-v3)
aot="${MODALCHAIN_AOT:-}"
if [ -z "$aot" ]; then
  dotnet publish "$repo/src/ModalChain.Cli" -c Release -r "$rid" -p:PublishAot=true "${isa[@]}" -o "$work/aot-bin" -v quiet -nologo
  aot="$work/aot-bin/modalchain"
fi
dotnet build "$repo/src/ModalChain.Cli" -c Release -o "$work/normal-bin" -v quiet -nologo
exec /usr/bin/python3 "$here/parity.py" "$aot" "$work/normal-bin/modalchain.dll" "$work" "$@"
