"""Reference values from scikit-rf (Debian's python3-scikit-rf) for scatterbook's tests.

Usage: /usr/bin/python3 skrf_dump.py FILE...   (prints one JSON object on stdout)

For each file: what scikit-rf reads (frequency, S, z0) and what it derives
(dB, phase, unwrapped phase, VSWR, group delay, Z, Y, S renormalized to 75 ohm,
mixed-mode for 4-ports, noise parameters). Complex arrays are [re, im] pairs,
non-finite numbers are null. Nothing here is scatterbook code.
"""
import json
import math
import sys
import warnings

warnings.filterwarnings("ignore")
import numpy as np

# scikit-rf 0.15.4 still uses aliases that numpy 1.24 removed.
for _alias, _type in (("int", int), ("float", float), ("complex", complex), ("bool", bool), ("object", object)):
    if _alias not in np.__dict__:
        setattr(np, _alias, _type)

import contextlib  # noqa: E402

with contextlib.redirect_stdout(sys.stderr):  # skrf prints a notice about matplotlib on import
    import skrf  # noqa: E402


def real(a):
    return [None if not math.isfinite(float(x)) else float(x) for x in np.asarray(a, dtype=float).ravel()]


def cplx(a):
    a = np.asarray(a, dtype=complex).ravel()
    return [[None if not math.isfinite(x.real) else float(x.real), None if not math.isfinite(x.imag) else float(x.imag)] for x in a]


def dump(path):
    out = {"file": path}
    try:
        n = skrf.Network(path)
    except Exception as e:  # the reference refused the file
        out["error"] = f"{type(e).__name__}: {e}"
        return out
    out["ports"] = int(n.nports)
    out["f"] = real(n.f)
    out["z0"] = cplx(n.z0)
    out["s"] = cplx(n.s)
    out["s_db"] = real(n.s_db)
    out["s_deg"] = real(n.s_deg)
    out["s_deg_unwrap"] = real(n.s_deg_unwrap)
    out["vswr"] = real(n.s_vswr)
    if len(n.f) > 1:
        out["group_delay"] = real(np.real(n.group_delay))
    def attempt(key, fn):
        # scikit-rf raises where a matrix is singular (Z of a series element, say); the key is then left out
        try:
            with np.errstate(all="ignore"):
                out[key] = fn()
        except np.linalg.LinAlgError:
            pass

    attempt("z", lambda: cplx(n.z))
    attempt("y", lambda: cplx(n.y))

    def renormalized():
        r = n.copy()
        r.renormalize(75)
        return cplx(r.s)

    attempt("s75", renormalized)
    if n.nports == 4:
        def mixed():
            m = n.copy()
            m.se2gmm(p=2)
            out["mixed_z0"] = cplx(m.z0)
            return cplx(m.s)

        attempt("mixed", mixed)
    if n.nports == 2:
        attempt("abcd", lambda: cplx(n.a))
    # Noise as read (skrf's Network interpolates it onto the network grid).
    t = skrf.io.touchstone.Touchstone(path)
    if t.noise is not None:
        nz = np.asarray(t.noise, dtype=float)
        out["noise_f"] = real(nz[:, 0] * t.frequency_mult)
        out["nfmin_db"] = real(nz[:, 1])
        out["g_opt"] = cplx(nz[:, 2] * np.exp(1j * np.deg2rad(nz[:, 3])))
        out["rn_ohm"] = real(nz[:, 4] * float(t.resistance))
    return out


if __name__ == "__main__":
    json.dump({"version": skrf.__version__, "files": [dump(p) for p in sys.argv[1:]]}, sys.stdout, allow_nan=False)
