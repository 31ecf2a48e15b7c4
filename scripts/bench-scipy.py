# Reference timing for `npm run bench`: scipy's eigsh (ARPACK, shift-invert about sigma = 0 with a SuperLU
# factorisation) on a matrix exported by scripts/bench.ts. Prints one JSON object on stdout.
import json
import resource
import statistics
import sys
import time


def main() -> int:
    if len(sys.argv) != 4:
        print("usage: bench-scipy.py <matrix.json> <k> <repeats>", file=sys.stderr)
        return 2
    try:
        import numpy as np
        import scipy
        import scipy.sparse as sp
        import scipy.sparse.linalg as sla
    except ImportError as error:
        print(json.dumps({"available": False, "reason": f"scipy is not importable: {error}"}))
        return 0
    meta_path, k, repeats = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
    with open(meta_path) as f:
        meta = json.load(f)
    base = meta_path[: -len(".json")]
    n = meta["n"]
    row_ptr = np.fromfile(base + ".rowptr.i32", dtype=np.int32)
    col_idx = np.fromfile(base + ".colidx.i32", dtype=np.int32)
    values = np.fromfile(base + ".re.f64", dtype=np.float64)
    if meta["complex"]:
        values = values + 1j * np.fromfile(base + ".im.f64", dtype=np.float64)
    a = sp.csr_matrix((values, col_idx, row_ptr), shape=(n, n))
    times = []
    result = None
    for _ in range(repeats):
        start = time.perf_counter()
        # Default shift-invert mode: ARPACK on (A - sigma I)^-1 applied through scipy.sparse.linalg.splu.
        result = sla.eigsh(a, k=k, sigma=0, which="LM")
        times.append(time.perf_counter() - start)
    w, v = result
    order = np.argsort(w)
    w = w[order]
    v = v[:, order]
    residuals = [float(np.linalg.norm(a @ v[:, j] - w[j] * v[:, j])) for j in range(k)]
    print(
        json.dumps(
            {
                "available": True,
                "python": sys.version.split()[0],
                "scipy": scipy.__version__,
                "numpy": np.__version__,
                "seconds": times,
                "medianSeconds": statistics.median(times),
                "values": [float(x) for x in w],
                "residualNorms": residuals,
                "peakRssMB": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024,
            }
        )
    )
    return 0


if __name__ == "__main__":
    sys.exit(main())
