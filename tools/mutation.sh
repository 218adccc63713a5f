#!/usr/bin/env bash
# Mutation testing with mutmut over the engine, the history store and atomic writes.
#
# Usage: tools/mutation.sh TARGET [MAX_CHILDREN]
#   TARGET: certificate | atomic | schema | engine | history | a path under dispatcher/
#   MAX_CHILDREN: parallel test runs (default 1: the cores are shared)
#   MUTATION_TESTS (environment): the test files to run instead of the target's list
#
# Not part of CI (slow: every mutant re-runs the related tests). It works on a scratch
# copy of the checkout under ${MUTATION_DIR:-/tmp/dispatcher-mutation}/TARGET, so the
# working tree never holds mutants. At the end it prints mutmut's results (one line per
# surviving mutant) and a summary line "killed K of N, survived S (P %)".
# Inspect a survivor with: cd SCRATCH && mutmut show NAME
set -euo pipefail

target=${1:?usage: tools/mutation.sh certificate|atomic|schema|engine|history|PATH [MAX_CHILDREN]}
children=${2:-1}
root=$(cd "$(dirname "$0")/.." && pwd)
python=${PYTHON:-python}
mutmut=${MUTMUT:-mutmut}

engine_tests="tests/test_engine_properties.py tests/test_engine_inputs.py
tests/test_engine_reference.py tests/test_structured_square.py tests/test_verify_refuses.py
tests/test_certificate_details.py tests/test_engine_rush.py
tests/test_ranking.py tests/test_ranking_slots.py tests/test_whatif.py
tests/test_redispatch.py tests/test_fill_shift.py"
history_tests=$(cd "$root" && ls tests/test_history_*.py)
deselect=
case "$target" in
  certificate) mutate=dispatcher/engine/certificate.py
               tests="tests/test_verify_refuses.py tests/test_structured_square.py
tests/test_certificate_details.py tests/test_engine_inputs.py tests/test_engine_rush.py
tests/test_whatif.py" ;;
  atomic)      mutate=dispatcher/atomic.py; tests="tests/test_atomic.py" ;;
  # The schema's own tests; the SIGKILL test is timing-bound (it fails on a loaded machine).
  schema)      mutate=dispatcher/history/schema.py
               tests="tests/test_history_errors.py tests/test_history_append_only.py
tests/test_history_reliability.py"
               deselect="tests/test_history_reliability.py::test_sigkill_at_random_moments_keeps_every_returned_decision" ;;
  engine)      mutate="dispatcher/engine/*"; tests="$engine_tests" ;;
  history)     mutate="dispatcher/history/*"; tests="$history_tests" ;;
  dispatcher/*) mutate=$target; tests="$engine_tests $history_tests tests/test_atomic.py" ;;
  *) echo "unknown target: $target" >&2; exit 2 ;;
esac

# MUTATION_TESTS="tests/a.py tests/b.py" runs only those test files (one module at a time
# with its own tests keeps a run short on shared cores).
tests=${MUTATION_TESTS:-$tests}

scratch=${MUTATION_DIR:-/tmp/dispatcher-mutation}/$(echo "$target" | tr '/*' '__')
rm -rf "$scratch"
mkdir -p "$scratch"
(cd "$root" && git ls-files -co --exclude-standard -z | tar --null -cf - -T -) | tar -xf - -C "$scratch"
cd "$scratch"
# mutmut reads [tool.mutmut] from pyproject.toml, else [mutmut] from setup.cfg.
{
  echo "[mutmut]"
  echo "source_paths=dispatcher"
  echo "only_mutate=$mutate"
  echo "also_copy="  # data the tests read (mutmut copies only the sources and tests)
  for d in sample_shops resources docs; do echo "    $d"; done
  # One argument per line: mutmut passes a one-line value to pytest as a single argument.
  echo "pytest_add_cli_args="
  for a in -p no:cacheprovider -x -q ${deselect:+--deselect $deselect}; do echo "    $a"; done
  echo "pytest_add_cli_args_test_selection="
  for t in $tests; do echo "    $t"; done
} > setup.cfg
export QT_QPA_PLATFORM=offscreen
"$mutmut" run --max-children "$children" || true
"$mutmut" results || true
"$python" - <<'PY'
import json, pathlib
counts = {}
for meta in pathlib.Path("mutants").rglob("*.meta"):
    for name, code in json.loads(meta.read_text()).get("exit_code_by_key", {}).items():
        kind = ("killed" if code not in (0, None, 33, 34) else
                "survived" if code == 0 else "other")
        counts[kind] = counts.get(kind, 0) + 1
total = sum(counts.values())
survived = counts.get("survived", 0)
print(f"killed {counts.get('killed', 0)} of {total}, survived {survived} "
      f"({100.0 * survived / max(total, 1):.1f} %), other {counts.get('other', 0)}")
PY
