#!/usr/bin/env bash
# Key press to finished frame in the real editor, in a real terminal (tmux, 80×24), for the benchmark
# loops of order 10 and 20. The editor itself times each handled key to the end of the next completed
# layout-and-draw (COMPASSIST_FRAME_TIMES, see src/CompAssist.Tui/FrameTimer.cs); this script sends arrow
# keys 40 ms apart and prints p50/p95. Usage: bench/editor-key-to-frame.sh [keys] [command...]
set -euo pipefail
cd "$(dirname "$0")/.."
keys=${1:-300}; shift || true
cmd=${*:-dotnet src/CompAssist.Cli/bin/Release/net10.0/compassist.dll}
work=$(mktemp -d); trap 'tmux kill-server 2>/dev/null || true; rm -rf "$work"' EXIT
dotnet bench/CompAssist.Benchmarks/bin/Release/net10.0/CompAssist.Benchmarks.dll --write-cases "$work" >/dev/null
for order in 10 20; do
  s="key-to-frame-$order"
  times="${TIMES_DIR:-$work}/times-$order.txt"; rm -f "$times"
  tmux new-session -d -s "$s" -x 80 -y 24 "COMPASSIST_FRAME_TIMES=$times $cmd edit $work/order$order.toml"
  until tmux capture-pane -p -t "$s" | grep -qF "C(s) = "; do sleep 0.05; done
  for i in $(seq 1 "$keys"); do
    if [ $((i % 2)) -eq 0 ]; then tmux send-keys -t "$s" Left; else tmux send-keys -t "$s" Right; fi
    sleep 0.04
  done
  sleep 0.5
  tmux send-keys -t "$s" C-q d; sleep 0.3; tmux kill-session -t "$s" 2>/dev/null || true
  sort -n "$times" | awk -v order="$order" '{a[NR]=$1} END {printf "order %d: %d keys, key to frame p50 %.2f ms, p95 %.2f ms, max %.2f ms\n", order, NR, a[int(NR*0.5)+1], a[int(NR*0.95)], a[NR]}'
done
