#!/usr/bin/env bash
# Peak memory of the editor after a minute of key presses in a real terminal (tmux, 80×24): moves the
# target with arrow keys (about 20 a second), switches step size and mode now and then, then reads the
# process's peak resident set (VmHWM). Usage: bench/editor-memory.sh [seconds] [command...]
set -euo pipefail
cd "$(dirname "$0")/.."
seconds=${1:-60}; shift || true
cmd=${*:-dotnet src/CompAssist.Cli/bin/Release/net10.0/compassist.dll}
work=$(mktemp -d); s="editor-memory-$$"
trap 'tmux kill-session -t "$s" 2>/dev/null || true; rm -rf "$work"' EXIT
cp cases/belt-axis.toml "$work/"
tmux new-session -d -s "$s" -x 80 -y 24 "$cmd edit $work/belt-axis.toml"
until tmux capture-pane -p -t "$s" | grep -qF "C(s) = "; do sleep 0.05; done
# The editor's own process (not the shell tmux started it from): the matching process with the largest RSS.
pid=$(for p in $(pgrep -f "edit $work/belt-axis.toml"); do echo "$(awk '/VmRSS/ {print $2}' /proc/$p/status) $p"; done | sort -n | tail -1 | cut -d' ' -f2)
echo "editor process $pid ($(cat /proc/$pid/comm))"
echo "after the first frame: $(grep -E 'VmHWM|VmRSS' /proc/$pid/status | tr -s ' ' | tr '\n' ' ')"
keys=(Left Right Up Down Left Up Right Down)
end=$(( $(date +%s) + seconds )); n=0
while [ "$(date +%s)" -lt "$end" ]; do
  tmux send-keys -t "$s" "${keys[$((n % 8))]}"
  n=$((n + 1))
  if [ $((n % 97)) -eq 0 ]; then tmux send-keys -t "$s" f; fi
  if [ $((n % 193)) -eq 0 ]; then tmux send-keys -t "$s" m; fi
  sleep 0.05
done
sleep 1
tmux capture-pane -p -t "$s" | grep -q "C(s) = " || { echo "the editor is not showing a design any more" >&2; exit 1; }
echo "after $n key presses in ${seconds} s: $(grep -E 'VmHWM|VmRSS' /proc/$pid/status | tr -s ' ' | tr '\n' ' ')"
