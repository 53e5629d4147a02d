"""Peer solver for the SlotOpt sheet bench: the same linear system A x = b, read from Matrix Market
files, solved by conjugate gradients preconditioned with hypre BoomerAMG and with PETSc GAMG
(petsc4py, one process, one thread), to the same stopping rule as SlotOpt: the true relative
residual |b - A x| / |b| <= 1e-8 (unpreconditioned norm, absolute tolerance 0).

Run by SlotOpt.Bench (case `peer`) as one long-lived process so that its repeats interleave with
SlotOpt's. Protocol on stdin, one command a line, one JSON line back on stdout:
  load MATRIX.mtx RHS.mtx          -> {"ok": true, "rows": n, "nonzeros": nnz}
  solve hypre|gamg                 -> {"ok": true, "seconds": setup+solve, "cpu_seconds" (the process's CPU time over the same span),
                                      "setup_seconds", "solve_seconds", "iterations", "relative_residual"}
  quit
Setup = building the preconditioner (KSPSetUp); the matrix itself is assembled before the clock starts.
Needs Debian's python3-petsc4py-real; its module sits under PETSc's directory, so PYTHONPATH must
point there (see tests/SlotOpt.Bench/peer/README.md).
"""
import json
import sys
import time

import numpy as np
import petsc4py

petsc4py.init([])
from petsc4py import PETSc  # noqa: E402

RELATIVE_RESIDUAL = 1e-8


def read_matrix_market(path):
    """Coordinate real general Matrix Market file -> CSR arrays (indptr, indices, values), shape."""
    with open(path, "r") as f:
        header = f.readline()
        if not header.startswith("%%MatrixMarket matrix coordinate real general"):
            raise ValueError(f"{path}: expected a coordinate real general matrix, got {header.strip()}")
        line = f.readline()
        while line.startswith("%"):
            line = f.readline()
        rows, cols, nnz = (int(t) for t in line.split())
        data = np.fromstring(f.read(), sep=" ")
    if data.size != 3 * nnz:
        raise ValueError(f"{path}: expected {nnz} entries, read {data.size / 3}")
    data = data.reshape(nnz, 3)
    r = data[:, 0].astype(np.int32) - 1
    c = data[:, 1].astype(np.int32) - 1
    v = data[:, 2]
    order = np.lexsort((c, r))
    r, c, v = r[order], c[order], v[order]
    indptr = np.zeros(rows + 1, dtype=np.int32)
    np.add.at(indptr, r + 1, 1)
    np.cumsum(indptr, out=indptr)
    return indptr, c, np.ascontiguousarray(v), rows, cols


def read_vector_market(path):
    """Array real general Matrix Market file (one column) -> numpy vector."""
    with open(path, "r") as f:
        header = f.readline()
        if not header.startswith("%%MatrixMarket matrix array real general"):
            raise ValueError(f"{path}: expected an array real general vector, got {header.strip()}")
        line = f.readline()
        while line.startswith("%"):
            line = f.readline()
        rows, cols = (int(t) for t in line.split())
        data = np.fromstring(f.read(), sep=" ")
    if cols != 1 or data.size != rows:
        raise ValueError(f"{path}: expected {rows} x 1 values, read {data.size}")
    return data


class System:
    def __init__(self, matrix_path, rhs_path):
        indptr, indices, values, rows, cols = read_matrix_market(matrix_path)
        self.nonzeros = int(values.size)
        self.rows = rows
        self.A = PETSc.Mat().createAIJ(size=(rows, cols), csr=(indptr, indices, values), comm=PETSc.COMM_SELF)
        self.A.assemble()
        self.A.setOption(PETSc.Mat.Option.SYMMETRIC, True)
        self.A.setOption(PETSc.Mat.Option.SPD, True)
        b = read_vector_market(rhs_path)
        self.b = PETSc.Vec().createWithArray(b, comm=PETSc.COMM_SELF)
        self.norm_b = self.b.norm()

    def solve(self, preconditioner):
        x = self.b.duplicate()
        x.set(0.0)
        ksp = PETSc.KSP().create(comm=PETSc.COMM_SELF)
        ksp.setType("cg")
        ksp.setNormType(PETSc.KSP.NormType.UNPRECONDITIONED)
        ksp.setTolerances(rtol=RELATIVE_RESIDUAL, atol=0.0, max_it=1000)
        pc = ksp.getPC()
        if preconditioner == "hypre":
            pc.setType("hypre")
            pc.setHYPREType("boomeramg")
        elif preconditioner == "gamg":
            pc.setType("gamg")
        else:
            raise ValueError(f"unknown preconditioner {preconditioner}")
        ksp.setOperators(self.A)
        cpu_start = time.process_time()
        start = time.perf_counter()
        ksp.setUp()
        set_up = time.perf_counter()
        ksp.solve(self.b, x)
        end = time.perf_counter()
        cpu_end = time.process_time()
        r = self.b.duplicate()
        self.A.mult(x, r)
        r.aypx(-1.0, self.b)
        relative = r.norm() / self.norm_b
        converged = ksp.getConvergedReason() > 0
        result = {
            "ok": bool(converged),
            "seconds": end - start,
            "cpu_seconds": cpu_end - cpu_start,
            "setup_seconds": set_up - start,
            "solve_seconds": end - set_up,
            "iterations": ksp.getIterationNumber(),
            "relative_residual": relative,
        }
        ksp.destroy()
        x.destroy()
        r.destroy()
        return result


def main():
    system = None
    for line in sys.stdin:
        words = line.split()
        if not words:
            continue
        try:
            if words[0] == "quit":
                break
            if words[0] == "load":
                system = System(words[1], words[2])
                reply = {"ok": True, "rows": system.rows, "nonzeros": system.nonzeros}
            elif words[0] == "solve":
                if system is None:
                    raise ValueError("solve before load")
                reply = system.solve(words[1])
            else:
                raise ValueError(f"unknown command {words[0]}")
        except Exception as e:  # report to the bench, keep serving
            reply = {"ok": False, "error": f"{type(e).__name__}: {e}"}
        sys.stdout.write(json.dumps(reply) + "\n")
        sys.stdout.flush()


if __name__ == "__main__":
    main()
