"""Independent cross-check of the nitrogen figures of the physics tests (equation of state, accumulator,
cylinder contents and usable gas, full recharge from vented).

Written from ../shared/reference/nitrogen-span2000.json only (Span et al. 2000), in another language
and by another method than src/physics/nitrogen.ts: the Helmholtz energy is evaluated in 40-digit
arithmetic (mpmath) and every derivative is taken numerically by mpmath.diff; densities are found by
bisection (mpmath.findroot, anderson) instead of Newton with analytic slopes.
Run: python3 tests/physics/crosscheck/span2000_check.py [path to nitrogen-span2000.json] (needs mpmath).
Importing it (as relief_check.py does) loads the model without printing.
It is a reviewer's tool, not part of the test suite; its output on 2026-12-02 is in span2000_check.out.
"""
import json, sys
from pathlib import Path
import mpmath as mp

mp.mp.dps = 40
ref = json.loads((Path(__file__).resolve().parents[4] / "shared/reference/nitrogen-span2000.json").read_text()) \
    if len(sys.argv) < 2 else json.loads(Path(sys.argv[1]).read_text())
C = ref["constants"]
R = mp.mpf(C["R_J_per_molK"]); TC = mp.mpf(C["Tc_K"]); RHOC = mp.mpf(C["rhoc_mol_per_dm3"]) * 1000
I = ref["ideal_part"]; P = ref["residual_polynomial"]; E = ref["residual_exponential"]; G = ref["residual_gaussian"]

def a0(d, t):
    return (mp.log(d) + I["a1"] * mp.log(t) + I["a2"] + I["a3"] * t + I["a4"] / t + I["a5"] / t**2
            + I["a6"] / t**3 + I["a7"] * mp.log(1 - mp.exp(-I["a8"] * t)))

def ar(d, t):
    s = mp.mpf(0)
    for n, dd, tt in zip(P["n"], P["d"], P["t"]):
        s += n * d**dd * t**tt
    for n, dd, tt, c in zip(E["n"], E["d"], E["t"], E["c"]):
        s += n * d**dd * t**tt * mp.exp(-d**c)
    for n, dd, tt, ph, be, ga in zip(G["n"], G["d"], G["t"], G["phi"], G["beta"], G["gamma"]):
        s += n * d**dd * t**tt * mp.exp(-ph * (d - 1)**2 - be * (t - ga)**2)
    return s

def model(real):
    res = ar if real else (lambda d, t: mp.mpf(0))
    def p(rho, T):
        d = rho / RHOC; t = TC / T
        return rho * R * T * (1 + d * mp.diff(lambda x: res(x, t), d))
    def u(rho, T):  # J/mol, u/RT = tau*(a0_tau + ar_tau)
        d = rho / RHOC; t = TC / T
        return R * T * t * mp.diff(lambda x: a0(d, x) + res(d, x), t)
    def s(rho, T):  # J/(mol K)
        d = rho / RHOC; t = TC / T
        return R * (t * mp.diff(lambda x: a0(d, x) + res(d, x), t) - a0(d, t) - res(d, t))
    def rho(pa, T):  # gas-like root by bisection from ideal-gas bracket
        lo, hi = mp.mpf(1e-6), 3 * pa / (R * T) + 1
        return mp.findroot(lambda r: p(r, T) - pa, (lo, hi), solver="anderson")
    return p, u, s, rho

PSI = mp.mpf("6894.757293168361"); ATM = mp.mpf(101325)
def psig(x): return x * PSI + ATM
def topsig(pa): return (pa - ATM) / PSI
def fK(f): return (mp.mpf(f) - 32) * 5 / 9 + mp.mpf("273.15")
def cK(c): return mp.mpf(c) + mp.mpf("273.15")

def main():
    # Self-check against the paper's table (Span et al. 2000, p. 1410): 350 K, 20 MPa -> 6.3552 mol/dm3.
    print("check: rho(20 MPa, 350 K) =", mp.nstr(model(True)[3](mp.mpf(20e6), mp.mpf(350)) / 1000, 6), "mol/dm3 (published 6.3552)")

    for name, real in (("real", True), ("ideal", False)):
        p, u, s, rho = model(real)
        print(f"== {name}")
        # precharge lines
        r = rho(psig(1450), fK(70)); print(" 1450 psig@70F at 50F:", mp.nstr(topsig(p(r, fK(50))), 7))
        r = rho(psig(100), fK(70)); print(" 100 psig@70F at -40F:", mp.nstr(topsig(p(r, fK(-40))), 6))
        r = rho(100e5 + ATM, cK(20)); print(" 100 barg@20C at -30C (barg):", mp.nstr((p(r, cK(-30)) - ATM) / 1e5, 6))
        # readings, V0 = 5 L, Vmin = 1.5 L
        v0, vmin = mp.mpf("5e-3"), mp.mpf("1.5e-3")
        n = rho(psig(1450), fK(70)) * v0
        for f in (-40, 50, 70):
            v = n / rho(psig(3000), fK(f))
            print(f" reading at {f} F: {mp.nstr((v0 - v) / (v0 - vmin) * 100, 6)} %")
        # isentropic discharge from 3000 psig at 70 F to 1000 psig
        T1 = fK(70); r1 = rho(psig(3000), T1); v1 = n / r1; s1 = s(r1, T1)
        T2 = mp.findroot(lambda T: s(rho(psig(1000), T), T) - s1, (fK(-150), T1), solver="anderson")
        r2 = rho(psig(1000), T2); v2 = n / r2
        W = n * (u(r1, T1) - u(r2, T2))
        print(" discharge: gas work kJ", mp.nstr(W / 1000, 6), " hydraulic kJ", mp.nstr((W - ATM * (v2 - v1)) / 1000, 6),
              " fluid L", mp.nstr((v2 - v1) * 1000, 6), " T2 K", mp.nstr(T2, 6))
        # trapped, rigid, 3000 psig at 10 C to -20 C
        r = rho(psig(3000), cK(10)); print(" trapped rigid 10C->-20C:", mp.nstr(topsig(p(r, cK(-20))), 7))
        # 1 L unit
        v0 = mp.mpf("1e-3"); n = rho(psig(1450), fK(70)) * v0
        rc = rho(psig(3000), cK(20)); vgc = n / rc
        print(" 1 L rigid 20C->-20C:", mp.nstr(topsig(p(rc, cK(-20))), 7))
        alpha, K, line = mp.mpf("8e-4"), mp.mpf("1.5e9"), mp.mpf("0.2e-3")
        vfc = v0 - vgc + line; pc = psig(3000); T = cK(-20)
        def bal(pa):
            return n / rho(pa, T) + vfc * (1 + alpha * (T - cK(20)) - (pa - pc) / K) - (vgc + vfc)
        pt = mp.findroot(bal, (psig(1500), psig(3000)), solver="anderson")
        print(" 1 L with fluid alpha/K/0.2 L:", mp.nstr(topsig(pt), 7))


    # Cylinder contents and usable gas (docs/methods.md §7): 49.9 L water volume filled to 2640 psig at 70 F,
    # spent at the lowest precharge target + 50 psi; molar mass 28.01348 g/mol (Span et al. 2000).
    p, u, s, rho = model(True)
    MKG = mp.mpf("0.02801348"); VC = mp.mpf("49.9e-3"); T70 = fK(70); TM30 = cK(-30)
    n_full = rho(psig(2640), T70) * VC
    print("== cylinder 49.9 L, 2640 psig @ 70 F")
    print(" full kg", mp.nstr(n_full * MKG, 7), " scf", mp.nstr(n_full * MKG / (mp.mpf("1.160424") * mp.mpf("0.028316846592")), 6))
    res = rho(psig(1500), T70) * VC
    print(" 70 F, residual at 1500 psig: residual kg", mp.nstr(res * MKG, 7), " usable kg", mp.nstr((n_full - res) * MKG, 7),
          " usable %", mp.nstr((n_full - res) / n_full * 100, 5))
    print(" full at -30 C reads psig", mp.nstr(topsig(p(n_full / VC, TM30)), 7))
    res = rho(psig(1500), TM30) * VC
    print(" -30 C, residual at 1500 psig: usable kg", mp.nstr((n_full - res) * MKG, 7))
    line = topsig(p(rho(psig(1450), T70), TM30))
    res = rho(psig(line + 50), TM30) * VC
    print(" 1450 psig @ 70 F line at -30 C psig", mp.nstr(line, 7), "; residual at line + 50 psi: usable kg", mp.nstr((n_full - res) * MKG, 7))
    # Full recharge from vented of a 250 in3 gas side serviced to 1200 psig @ 70 F, gas and site at 70 F and at -20 C.
    v0 = 250 * mp.mpf("0.0254")**3
    n_ref = rho(psig(1200), T70) * v0
    for name, T in (("70 F", T70), ("-20 C", cK(-20))):
        n_atm = rho(ATM, T) * v0
        print(f" full recharge at {name}: adds kg", mp.nstr((n_ref - n_atm) * MKG, 7), " vented share %", mp.nstr(n_atm / n_ref * 100, 4))


if __name__ == "__main__":
    main()
