#!/usr/bin/env bash
# Builds every bundled pattern (patterns/*.json) and the scaffold of every target kind and family with the CLI
# and prints one line per job: exit code and the first stderr line. Exit 4 (internal error) must never appear;
# exit 1 (bad input, e.g. a scaffold's placeholder image or mesh file) and 2 (fit not converged, sheets refused)
# are honest answers. Usage: bash tests/exit-code-sweep.sh [seconds per build, default 600]
set -u
root="$(cd "$(dirname "$0")/.." && pwd)"
limit="${1:-600}"
work="$(mktemp -d)"
dotnet build "$root/src/Tessel.Cli" -v q -nologo >/dev/null || exit 1
tessel="$root/src/Tessel.Cli/bin/Debug/net10.0/tessel"
jobs=()
for p in "$root"/patterns/*.json; do [[ "$p" == *schema* ]] || jobs+=("$p"); done
for kind in $("$tessel" catalog targets | awk '{print $1}'); do
  for family in $("$tessel" catalog families | awk '{print $1}'); do
    (cd "$work" && "$tessel" scaffold --target "$kind" --family "$family" --out "$kind-$family.json" >/dev/null) && jobs+=("$work/$kind-$family.json")
  done
done
fours=0
for job in "${jobs[@]}"; do
  name="$(basename "$job" .json)"
  timeout "$limit" "$tessel" build "$job" --out "$work/out-$name" --quiet >/dev/null 2>"$work/$name.err"
  code=$?
  [[ $code == 4 ]] && fours=$((fours + 1))
  printf '%-42s exit %-3s %s\n' "$name" "$code" "$(head -c 160 "$work/$name.err" | head -1)"
done
echo "internal errors (exit 4): $fours of ${#jobs[@]} jobs"
rm -rf "$work"
[[ $fours == 0 ]]
