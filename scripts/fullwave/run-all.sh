#!/bin/sh
# Design every spec in scripts/fullwave/specs/ with tunestrip and simulate it with openEMS,
# rewriting scripts/fullwave/results.json. Run from anywhere; needs a built dist/ (npm run build).
# Usage: scripts/fullwave/run-all.sh [WORK_DIR]   (default /tmp/fullwave)
set -eu
here=$(cd "$(dirname "$0")" && pwd)
root=$(cd "$here/../.." && pwd)
work=${1:-/tmp/fullwave}
mkdir -p "$work/designs"
for spec in "$here"/specs/*.yaml; do
  name=$(basename "$spec" .yaml)
  node "$root/dist/cli/bin.js" design "$spec" --out "$work/designs/$name" --force > /dev/null
  /usr/bin/python3 "$here/simulate.py" "$work/designs/$name" --spec "$spec" --work "$work"
done
# Three designs again with the copper drawn as a solid of the stackup's thickness (README, Limits).
/usr/bin/python3 "$here/simulate.py" "$work/designs/fw-5g8-hc-open" --thick --spec "$here/specs/fw-5g8-hc-open.yaml" --work "$work"
/usr/bin/python3 "$here/simulate.py" "$work/designs/fw-2g4-short-d400" --thick --spec "$here/specs/fw-2g4-short-d400.yaml" --work "$work"
/usr/bin/python3 "$here/simulate.py" "$work/designs/fw-1g8-complex-target" --thick --spec "$here/specs/fw-1g8-complex-target.yaml" --work "$work"
