#!/usr/bin/python3
"""1,000 random states of water and steam (seeded) in IAPWS-IF97 regions 1, 2 and 4, computed by
rxnheat and by Debian's python3-iapws (a reference implementation of IAPWS-IF97; a test dependency
only, never shipped or called by rxnheat), compared at a relative 1e-9.

rxnheat is driven through its shipped library's C interface (rxnheat_call over the catalogue:
STEAMH, STEAMTSAT, STEAMPSAT, STEAMLATENT), and a sample of the points through the command line
(`rxnheat steam ... --json`) as well.

Usage: test_steam_iapws.py PATH/TO/librxnheat.so PATH/TO/rxnheat
Prints the largest relative deviation seen for each quantity; exits 1 on any failure.
"""
import ctypes
import json
import math
import random
import subprocess
import sys

from iapws import IAPWS97
from iapws.iapws97 import _P23_T, _PSat_T, _TSat_P

TOLERANCE = 1e-9  # relative, on h (kJ/kg), p_sat and T_sat
SEED = 97_2012
N_REGION1, N_REGION2, N_REGION4 = 400, 400, 200  # 1,000 points
CLI_SAMPLE = 25  # of those, run through the command line too


class Value(ctypes.Structure):
    _fields_ = [("kind", ctypes.c_int), ("number", ctypes.c_double), ("text", ctypes.c_char_p),
                ("table", ctypes.c_void_p)]


class Result(ctypes.Structure):
    _fields_ = [("kind", ctypes.c_int), ("number", ctypes.c_double), ("unit", ctypes.c_char * 32),
                ("text_length", ctypes.c_size_t), ("argument", ctypes.c_size_t)]


class Library:
    def __init__(self, path):
        self.lib = ctypes.CDLL(path)
        self.lib.rxnheat_open.restype = ctypes.c_void_p
        self.lib.rxnheat_call.argtypes = [ctypes.c_void_p, ctypes.c_char_p, ctypes.POINTER(Value), ctypes.c_size_t,
                                          ctypes.POINTER(Result), ctypes.c_char_p, ctypes.c_size_t, ctypes.c_char_p,
                                          ctypes.c_size_t]
        self.engine = self.lib.rxnheat_open()

    def call(self, function, *args):
        """The number rxnheat gives, or raises with its message. Numbers are given as numbers,
        strings as text, None as omitted."""
        values = (Value * max(1, len(args)))()
        keep = []
        for i, a in enumerate(args):
            if a is None:
                values[i] = Value(0, 0.0, None, None)
            elif isinstance(a, str):
                keep.append(a.encode())
                values[i] = Value(2, 0.0, keep[-1], None)
            else:
                values[i] = Value(1, float(a), None, None)
        result = Result()
        err = ctypes.create_string_buffer(1024)
        status = self.lib.rxnheat_call(self.engine, function.encode(), values, len(args), ctypes.byref(result), None, 0,
                                       err, len(err))
        if status != 0:
            raise RuntimeError("%s%r: status %d: %s" % (function, args, status, err.value.decode()))
        return result.number, result.unit.decode()


def main():
    lib = Library(sys.argv[1])
    cli = sys.argv[2]
    rng = random.Random(SEED)
    failures = []
    worst = {}
    checked = 0

    def compare(quantity, ours, theirs, where):
        nonlocal checked
        checked += 1
        dev = abs(ours - theirs) / abs(theirs)
        if dev > worst.get(quantity, (0, ""))[0]:
            worst[quantity] = (dev, where)
        if not dev <= TOLERANCE:
            failures.append("%s at %s: rxnheat %r, python3-iapws %r (relative %.3g)" % (quantity, where, ours, theirs, dev))

    cli_points = []  # (arguments of rxnheat, expected value)

    # Region 1: 273.15 K <= T <= 623.15 K, ps(T) < p <= 100 MPa.
    for _ in range(N_REGION1):
        T = rng.uniform(273.15, 623.15)
        ps = _PSat_T(T)
        p = rng.uniform(ps * (1 + 1e-6), 100.0)
        st = IAPWS97(P=p, T=T)
        assert st.region == 1, (p, T, st.region)
        h, unit = lib.call("STEAMH", p * 10, T)
        assert unit == "kJ/kg", unit
        compare("h region 1", h, st.h, "p=%r MPa T=%r K" % (p, T))
        if len(cli_points) < CLI_SAMPLE // 3:
            cli_points.append((["steam", "h", "%r MPa" % p, "-T", repr(T)], st.h))

    # Region 2: 0 < p <= ps(T) for T <= 623.15 K; p <= B23 to 863.15 K; p <= 100 MPa to 1073.15 K.
    # Pressures log-uniform from 611.213 Pa (python3-iapws takes no lower pressure; IF97 region 2 does).
    bands = [(273.15, 623.15, lambda T: _PSat_T(T) * (1 - 1e-6)), (623.15, 863.15, _P23_T),
             (863.15, 1073.15, lambda T: 100.0)]
    for k in range(N_REGION2):
        lo, hi, p_max = bands[k % 3]
        T = rng.uniform(lo, hi)
        p = math.exp(rng.uniform(math.log(611.213e-6), math.log(p_max(T))))
        st = IAPWS97(P=p, T=T)
        assert st.region == 2, (p, T, st.region)
        h, _ = lib.call("STEAMH", "%r MPa" % p, T)
        compare("h region 2", h, st.h, "p=%r MPa T=%r K" % (p, T))
        if len(cli_points) < 2 * CLI_SAMPLE // 3:
            cli_points.append((["steam", "h", "%r kPa" % (p * 1000), "-T", repr(T)], st.h))

    # Region 4: saturation pressure at T, saturation temperature at p, and at p <= ps(623.15 K)
    # the saturated liquid and vapour and the latent heat.
    for k in range(N_REGION4):
        if k % 2 == 0:
            T = rng.uniform(273.15, 647.096)
            ps, unit = lib.call("STEAMPSAT", T)
            assert unit == "bar", unit
            # The region 4 equation itself (IAPWS97(T=T, x=0).P above 623.15 K is region 3's saturation
            # pressure, which differs from eq. 30 by up to 5e-5 relative near the critical point).
            compare("p_sat", ps / 10, _PSat_T(T), "T=%r K" % T)
            if len(cli_points) < CLI_SAMPLE - 3:
                cli_points.append((["steam", "psat", repr(T)], _PSat_T(T) * 10))
            continue
        p = math.exp(rng.uniform(math.log(611.213e-6), math.log(22.064)))
        Ts, unit = lib.call("STEAMTSAT", p * 10)
        assert unit == "K", unit
        liquid, vapour = IAPWS97(P=p, x=0), IAPWS97(P=p, x=1)
        compare("T_sat", Ts, _TSat_P(p), "p=%r MPa" % p)
        if p <= _PSat_T(623.15):
            hf, _ = lib.call("STEAMH", p * 10, None, "liquid")
            hg, _ = lib.call("STEAMH", p * 10, None, "vapour")
            latent, _ = lib.call("STEAMLATENT", p * 10)
            compare("h saturated liquid", hf, liquid.h, "p=%r MPa" % p)
            compare("h saturated vapour", hg, vapour.h, "p=%r MPa" % p)
            compare("latent heat", latent, vapour.h - liquid.h, "p=%r MPa" % p)
            if len(cli_points) < CLI_SAMPLE:
                cli_points.append((["steam", "latent", "%r bar" % (p * 10)], vapour.h - liquid.h))
                cli_points.append((["steam", "tsat", "%r MPa" % p], _TSat_P(p)))

    # The command line on a sample of the same kind of points.
    for args, expected in cli_points:
        out = subprocess.run([cli] + args + ["--json"], capture_output=True, text=True, timeout=60)
        if out.returncode != 0:
            failures.append("rxnheat %s: exit %d: %s" % (" ".join(args), out.returncode, out.stdout + out.stderr))
            continue
        compare("command line " + args[1], json.loads(out.stdout)["value"], expected, " ".join(args))

    for q in sorted(worst):
        print("%-22s largest relative deviation %.3g (%s)" % (q, worst[q][0], worst[q][1]))
    print("%d comparisons with python3-iapws (%d random states, seed %d), tolerance %g relative"
          % (checked, N_REGION1 + N_REGION2 + N_REGION4, SEED, TOLERANCE))
    for f in failures[:20]:
        print("FAIL:", f)
    if failures:
        print("%d failed" % len(failures))
        return 1
    return 0


if __name__ == "__main__":
    sys.exit(main())
