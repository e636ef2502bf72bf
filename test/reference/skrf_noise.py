"""Noise figures by scikit-rf (Debian's python3-scikit-rf), for test/reference/noise.test.ts.

For each file: the noise frequencies, NFmin in dB and NF in dB with the source
at the reference impedance, computed by scikit-rf's own route (the ABCD noise
correlation matrix of Network.set_noise_a, then Network.nf(z)), on a network
whose grid is the noise grid itself, so that no interpolation enters.
"""
import json
import sys

import numpy as np

for _a in ("int", "float", "complex", "bool", "object"):  # aliases numpy removed; scikit-rf 0.15 still uses them
    if not hasattr(np, _a):
        setattr(np, _a, {"int": int, "float": float, "complex": complex, "bool": bool, "object": object}[_a])
import skrf as rf  # noqa: E402

out = {"version": rf.__version__, "files": []}
for path in sys.argv[1:]:
    n = rf.Network(path)
    f = n.noise_freq.f
    z0 = n.z0[0, 0]
    m = rf.Network(frequency=rf.Frequency.from_f(f, unit="hz"), s=np.zeros((len(f), 2, 2), dtype=complex), z0=z0)
    m.noise = n.noise
    m.noise_freq = n.noise_freq
    nf = 10 * np.log10(np.real(m.nf(np.full(len(f), z0))))
    out["files"].append({"file": path, "f": f.tolist(), "nfmin_db": np.real(m.nfmin_db).tolist(), "nf_db": nf.tolist()})
print(json.dumps(out))
