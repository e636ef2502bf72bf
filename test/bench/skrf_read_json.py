"""scikit-rf 0.15 (Debian's python3-scikit-rf) reading a Touchstone file and writing the JSON of scatterbook read --json, for test/bench/read.bench.ts."""
import json, sys
import numpy as np
import warnings
warnings.simplefilter("ignore")
for _a in ("int", "float", "complex", "bool", "object"):  # aliases numpy removed; scikit-rf 0.15 still uses them
    if not hasattr(np, _a):
        setattr(np, _a, {"int": int, "float": float, "complex": complex, "bool": bool, "object": object}[_a])
import skrf as rf
n = rf.Network(sys.argv[1])
s = n.s
out = {"ports": n.nports, "version": "1.1", "parameter": "S", "mixedModeOrder": None, "frequencyHz": n.f.tolist(), "referenceOhms": n.z0[0].real.tolist(),
       "s": [[[[v.real, v.imag] for v in row] for row in m] for m in s], "noise": None}
sys.stdout.write(json.dumps(out))
