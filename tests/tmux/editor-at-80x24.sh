#!/usr/bin/env bash
# Runs the real editor in tmux at 80×24, sends keys as a user would and checks the captured screen:
# open a demo case, move the target, open and close help, save, reopen, quit; then the same with NO_COLOR
# and no colour escape in the captured screen. Usage: tests/tmux/editor-at-80x24.sh [path/to/compassist.dll]
# (default: the Debug build that `dotnet test` leaves). Exit 0 when every check passes.
set -euo pipefail
cd "$(dirname "$0")/../.."
dll=${1:-src/CompAssist.Cli/bin/Debug/net10.0/compassist.dll}
[ -f "$dll" ] || { echo "editor check: $dll not built" >&2; exit 1; }
command -v tmux >/dev/null || { echo "editor check: tmux not installed" >&2; exit 1; }

work=$(mktemp -d)
session="compassist-check-$$"
trap 'tmux kill-session -t "$session" 2>/dev/null || true; rm -rf "$work"' EXIT
cp cases/belt-axis.toml "$work/belt-axis.toml"
failures=0

screen() { tmux capture-pane -p -t "$session"; }

# Waits up to 60 s for the text to appear on the screen.
wait_for() {
  local text=$1
  for _ in $(seq 1 600); do
    if screen | grep -qF -- "$text"; then return 0; fi
    sleep 0.1
  done
  echo "FAIL: '$text' never appeared. Screen:" >&2
  screen >&2
  failures=$((failures + 1))
  return 1
}

check() { # description, text
  if screen | grep -qF -- "$2"; then echo "ok: $1"; else echo "FAIL: $1 ('$2' not on screen)" >&2; screen >&2; failures=$((failures + 1)); fi
}

start() { # extra environment, case
  tmux new-session -d -s "$session" -x 80 -y 24 "env $1 TERM=xterm-256color dotnet $dll edit $2; echo \"EXIT=\$?\" > $work/exit; sleep 60"
}

# 1. Open, move, help, save, quit.
start "" "$work/belt-axis.toml"
wait_for "C(s) = " && echo "ok: first frame shows the design"
check "the plant is shown" "G(s)  25/(s(s+5))"
check "the proof is shown" "stable ✓"
check "the picture has the target" "◆"
before=$(screen | grep -o 's\* [-0-9.]* ±' | head -1 || true)
tmux send-keys -t "$session" Left
wait_for "move target to" && echo "ok: a left arrow moves the target"
after=$(screen | grep -o 's\* [-0-9.]* ±' | head -1 || true)
if [ "$before" != "$after" ]; then echo "ok: the target heading changed ($before → $after)"; else echo "FAIL: target unchanged" >&2; failures=$((failures + 1)); fi
check "unsaved work is marked" "● unsaved"
tmux send-keys -t "$session" F1
wait_for "CompAssist keys" && echo "ok: F1 opens the keys"
tmux send-keys -t "$session" Escape
wait_for "C(s) = " && echo "ok: Esc closes the help page"
tmux send-keys -t "$session" C-s
wait_for "saved belt-axis.toml" && echo "ok: Ctrl+S saves"
tmux send-keys -t "$session" C-q
for _ in $(seq 1 100); do [ -f "$work/exit" ] && break; sleep 0.1; done
if [ "$(cat "$work/exit" 2>/dev/null)" = "EXIT=0" ]; then echo "ok: Ctrl+Q quits with exit code 0"; else echo "FAIL: no clean exit" >&2; failures=$((failures + 1)); fi
if grep -q '^target = \[' "$work/belt-axis.toml"; then echo "ok: the moved target is in the saved case"; else echo "FAIL: saved case has no target" >&2; failures=$((failures + 1)); fi
tmux kill-session -t "$session" 2>/dev/null || true
rm -f "$work/exit"

# 2. Reopen the saved case with NO_COLOR: the same target, and no colour escapes on screen.
start "NO_COLOR=1" "$work/belt-axis.toml"
wait_for "C(s) = " && echo "ok: the saved case reopens"
check "the reopened target is the saved one" "$after"
if tmux capture-pane -p -e -t "$session" | grep -qE $'\e\\[[0-9;]*(3[0-7]|9[0-7]|4[0-7]|10[0-7]|38;|48;)[0-9;]*m'; then
  echo "FAIL: colour escapes on screen with NO_COLOR" >&2; failures=$((failures + 1))
else
  echo "ok: NO_COLOR gives no colour"
fi
tmux send-keys -t "$session" C-q
for _ in $(seq 1 100); do [ -f "$work/exit" ] && break; sleep 0.1; done
[ "$(cat "$work/exit" 2>/dev/null)" = "EXIT=0" ] || { echo "FAIL: no clean exit (NO_COLOR run)" >&2; failures=$((failures + 1)); }

tmux kill-session -t "$session" 2>/dev/null || true
rm -f "$work/exit"

# 3. A dropped session (tmux kills the pane: SIGHUP) right after a key press keeps the work in the autosave.
# The autosave timer is set to an hour here, so only the hang-up handler can have written it.
start "COMPASSIST_AUTOSAVE_SECONDS=3600" "$work/belt-axis.toml"
wait_for "C(s) = " >/dev/null
tmux send-keys -t "$session" Up
wait_for "move target to" >/dev/null
moved=$(screen | grep -o 's\* [-0-9.]* ± [0-9.]*j' | head -1 || true)
tmux kill-session -t "$session"
for _ in $(seq 1 50); do [ -f "$work/belt-axis.autosave.toml" ] && break; sleep 0.1; done
if [ -f "$work/belt-axis.autosave.toml" ]; then
  echo "ok: the hung-up editor left belt-axis.autosave.toml ($moved)"
  im=$(echo "$moved" | sed -E 's/.*± ([0-9.]*)j/\1/')
  if grep -qE "^target = \\[.*, ${im}(\\.0+)?\\]" "$work/belt-axis.autosave.toml"; then echo "ok: the autosave holds the moved target"; else echo "FAIL: autosave without the moved target" >&2; cat "$work/belt-axis.autosave.toml" >&2; failures=$((failures + 1)); fi
else
  echo "FAIL: no autosave after the hang-up" >&2; failures=$((failures + 1))
fi

if [ "$failures" -ne 0 ]; then echo "editor check: $failures failure(s)" >&2; exit 1; fi
echo "editor check: all passed"
