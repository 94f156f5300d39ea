#!/usr/bin/env bash
# Time from launching the editor to its first complete frame, seen in a real terminal (tmux, 80×24):
# polls the screen every 10 ms until the design line appears. Usage:
#   bench/editor-first-frame.sh [runs] [command...]   (default: 5 runs of the Release build)
set -euo pipefail
cd "$(dirname "$0")/.."
runs=${1:-5}; shift || true
cmd=${*:-dotnet src/CompAssist.Cli/bin/Release/net10.0/compassist.dll}
work=$(mktemp -d); trap 'rm -rf "$work"' EXIT
cp cases/belt-axis.toml "$work/"
for i in $(seq 1 "$runs"); do
  s="first-frame-$$-$i"
  start=$(date +%s%N)
  tmux new-session -d -s "$s" -x 80 -y 24 "$cmd edit $work/belt-axis.toml"
  until tmux capture-pane -p -t "$s" 2>/dev/null | grep -qF "C(s) = "; do sleep 0.01; done
  end=$(date +%s%N)
  echo "run $i: $(( (end - start) / 1000000 )) ms"
  tmux send-keys -t "$s" C-q; sleep 0.3; tmux kill-session -t "$s" 2>/dev/null || true
done
