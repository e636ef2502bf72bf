"""Independent values for test/reference/compare.test.ts (Debian's python3-scikit-rf and numpy).

renormalize FILE…  : each file read by scikit-rf, renormalized to 50 ohm by Network.renormalize
                     (for real reference impedances power waves and pseudo-waves agree); its S as [re, im].
interp             : stdin {"fa", "va", "fb", "vb", "from", "to"}: the common grid built here (both
                     grids' points strictly inside the overlap of the grids and the band, and its two
                     ends) and va − vb on it by numpy.interp.
"""
import json
import sys

import numpy as np

for _a in ("int", "float", "complex", "bool", "object"):  # aliases numpy removed; scikit-rf 0.15 still uses them
    if not hasattr(np, _a):
        setattr(np, _a, {"int": int, "float": float, "complex": complex, "bool": bool, "object": object}[_a])

if sys.argv[1] == "renormalize":
    import skrf as rf  # noqa: E402

    out = {"version": rf.__version__, "files": []}
    for path in sys.argv[2:]:
        n = rf.Network(path)
        z0 = n.z0[0].real.tolist()
        n.renormalize(50)
        out["files"].append({"file": path, "z0": z0, "re": n.s.real.ravel().tolist(), "im": n.s.imag.ravel().tolist()})
    print(json.dumps(out))
else:
    d = json.load(sys.stdin)
    fa, va, fb, vb = (np.array(d[k], dtype=float) for k in ("fa", "va", "fb", "vb"))
    lo = max(fa[0], fb[0], d["from"])
    hi = min(fa[-1], fb[-1], d["to"])
    inner = np.union1d(fa[(fa > lo) & (fa < hi)], fb[(fb > lo) & (fb < hi)])
    grid = np.concatenate([[lo], inner, [hi]])
    print(json.dumps({"grid": grid.tolist(), "diff": (np.interp(grid, fa, va) - np.interp(grid, fb, vb)).tolist()}))
