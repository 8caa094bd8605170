#!/usr/bin/env bash
# Round trip of ringheat's NASA-7 export through an outside library: installs Cantera from PyPI
# into a virtual environment under the temporary directory (reused when it is already there),
# exports the species of tools/cantera_round_trip_species.smi with `ringheat polynomials`,
# loads them with Cantera and compares Cp, H and S with ringheat's own values
# (tools/cantera_round_trip.py says what is compared and the limits). `.ci/run` runs it.
set -euo pipefail
cd "$(dirname "$0")/.."

VENV="${RINGHEAT_CANTERA_VENV:-${TMPDIR:-/tmp}/ringheat-cantera-venv}"
CANTERA_PIN="${RINGHEAT_CANTERA_PIN:-cantera==3.2.0}"
if ! "$VENV/bin/python" -c "import cantera" >/dev/null 2>&1; then
  echo "installing $CANTERA_PIN into $VENV"
  python3 -m venv "$VENV"
  "$VENV/bin/pip" install --quiet --disable-pip-version-check "$CANTERA_PIN"
fi

cargo build --release --quiet
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
species=tools/cantera_round_trip_species.smi
# Some species are error rows by design (the tables lack their Cp): a run with error rows may
# exit with 3 (records failed), which is not a failure of the round trip.
target/release/ringheat polynomials --file "$species" --output "$work/species.yaml" ||
  [ $? -eq 3 ]
target/release/ringheat polynomials --file "$species" --format json \
  --at 300,500,1000,1500,2500 --output "$work/species.json" || [ $? -eq 3 ]
"$VENV/bin/python" tools/cantera_round_trip.py "$work/species.yaml" "$work/species.json"
