#!/bin/sh
# Re-record the reference results: runs every deck with the measurement script and collects
# the measured values into results.csv (deck,quantity,value), with the ngspice version.
# Usage: sh record.sh [deck.cir ...]   (default: every *.cir here; with a list, the other decks'
# rows of results.csv are kept)
set -eu
cd "$(dirname "$0")"
decks=${*:-$(ls *.cir)}
version=$(ngspice -v 2>/dev/null | grep -o 'ngspice-[0-9.]*' | head -n 1)
tmp=$(mktemp -d)
for deck in $decks; do
  name=${deck%.cir}
  start=$(date +%s)
  ngspice -b -D deck="$deck" -D out="$tmp/$name.txt" measure.ctl > "$tmp/$name.log" 2>&1 || true
  if [ ! -s "$tmp/$name.txt" ] || grep -q 'Timestep too small' "$tmp/$name.log"; then
    echo "$deck: run or measurement failed, see $tmp/$name.log" >&2; exit 1
  fi
  echo "$deck: $(( $(date +%s) - start )) s" >&2
done
{
  echo "deck,quantity,value"
  if [ $# -gt 0 ] && [ -f results.csv ]; then
    names=$(for deck in $decks; do printf '%s ' "${deck%.cir}"; done)
    awk -F, -v names=" $names" 'NR > 1 && index(names, " " $1 " ") == 0' results.csv
  fi
  for deck in $decks; do
    name=${deck%.cir}
    awk -v d="$name" '$2 == "=" { printf "%s,%s,%s\n", d, $1, $3 }' "$tmp/$name.txt"
    echo "$name,ngspice,$version"
  done
} > "$tmp/results.csv"
mv "$tmp/results.csv" results.csv
rm -rf "$tmp"
