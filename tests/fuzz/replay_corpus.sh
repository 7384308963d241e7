#!/usr/bin/env bash
# Replays fuzz-corpus files through a command and checks the exit contract of bad input.
#
#   replay_corpus.sh --timeout SECONDS [--shard I/N] -- COMMAND... -- FILE...
#
# Runs `COMMAND... FILE` for every FILE (with --shard I/N: the I-th of every N files, 0-based) under
# `timeout SECONDS`, in the file's folder. Exit code 0 (fine) or 2 (bad input) passes; anything
# else fails the file: 1 (internal error), 3, a signal (crash, abort, sanitizer report) or 124
# (the timeout: a hang). Prints every failed file with its exit code and the tail of its stderr;
# exits 0 when every file passed, 1 otherwise.
set -u
limit="" shard=0 shards=1
while [[ $# -gt 0 && "$1" != "--" ]]; do
  case "$1" in
    --timeout) limit="$2"; shift 2 ;;
    --shard) shard="${2%/*}"; shards="${2#*/}"; shift 2 ;;
    *) echo "replay_corpus.sh: unknown option $1" >&2; exit 1 ;;
  esac
done
shift
command=()
while [[ $# -gt 0 && "$1" != "--" ]]; do command+=("$1"); shift; done
shift
if [[ -z "$limit" || ${#command[@]} -eq 0 || $# -eq 0 ]]; then
  echo "usage: replay_corpus.sh --timeout SECONDS [--shard I/N] -- COMMAND... -- FILE..." >&2
  exit 1
fi

failed=0 ran=0 index=0
for file in "$@"; do
  (( index++ % shards == shard )) || continue
  ran=$((ran + 1))
  err="$(cd "$(dirname "$file")" && timeout "$limit" "${command[@]}" "$(basename "$file")" 2>&1 >/dev/null)"
  code=$?
  if [[ $code -ne 0 && $code -ne 2 ]]; then
    failed=$((failed + 1))
    [[ $code -eq 124 ]] && echo "FAILED: $file: no result within ${limit} s (a hang)" ||
      echo "FAILED: $file: exit code $code"
    printf '%s\n' "$err" | tail -n 5 | sed 's/^/    /'
  fi
done
echo "$ran files replayed, $failed failed"
[[ $failed -eq 0 ]]
