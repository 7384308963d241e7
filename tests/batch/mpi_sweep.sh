#!/usr/bin/env bash
# batch.mpi_sweep: `mpirun -n 3 rotcap sweep PLAN --mpi` (rank 0 dispatches, two worker ranks) and
# `rotcap sweep PLAN -j 2` give the same results.csv (every column but wall_s, the measured time).
#   mpi_sweep.sh ROTCAP MPIRUN SCRATCH PLAN
# Exits 77 (ctest: skipped) when rotcap was built without MPI (MPIRUN empty).
set -u
rotcap="$1" mpirun="$2" scratch="$3" plan="$4"
if [[ -z "$mpirun" ]]; then
  echo "rotcap was built without MPI (ROTCAP_MPI off): skipped"
  exit 77
fi
rm -rf "$scratch"
mkdir -p "$scratch"
export ROTCAP_NO_PDF=1 OPENBLAS_NUM_THREADS=1 OMP_NUM_THREADS=1
# Shared-memory and self transports only (one machine, root in a container).
export OMPI_MCA_btl=self,vader OMPI_MCA_btl_vader_single_copy_mechanism=none OMPI_MCA_plm_rsh_agent=
echo "running: $mpirun --allow-run-as-root --oversubscribe -n 3 $rotcap sweep $plan --mpi -o $scratch/mpi"
"$mpirun" --allow-run-as-root --oversubscribe -n 3 "$rotcap" sweep "$plan" --mpi -o "$scratch/mpi" >"$scratch/mpi.txt" 2>&1
code=$?
cat "$scratch/mpi.txt"
[[ $code -eq 0 ]] || { echo "FAILED: mpirun exit code $code"; exit 1; }
grep -q "on 2 worker rank(s)" "$scratch/mpi.txt" || { echo "FAILED: rank 0 did not dispatch to 2 worker ranks"; exit 1; }
"$rotcap" sweep "$plan" -j 2 -o "$scratch/local" >"$scratch/local.txt" 2>&1 || { cat "$scratch/local.txt"; echo "FAILED: local sweep"; exit 1; }
# results.csv without the wall_s column (found by name).
strip_wall() {
  python3 - "$1" <<'PY'
import csv, sys
rows = list(csv.reader(open(sys.argv[1], newline="")))
drop = rows[0].index("wall_s")
for r in rows:
    print(",".join(v for i, v in enumerate(r) if i != drop))
PY
}
strip_wall "$scratch/mpi/results.csv" >"$scratch/mpi_results.txt"
strip_wall "$scratch/local/results.csv" >"$scratch/local_results.txt"
[[ $(wc -l <"$scratch/mpi_results.txt") -eq 7 ]] || { echo "FAILED: results.csv of the MPI run has no 6 rows"; exit 1; }
if ! diff "$scratch/local_results.txt" "$scratch/mpi_results.txt"; then
  echo "FAILED: results.csv differs between mpirun -n 3 and one machine"
  exit 1
fi
echo "passed"
