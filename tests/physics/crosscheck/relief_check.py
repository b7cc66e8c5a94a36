"""Independent cross-check of the thermal-relief figures of the physics tests.

The nitrogen model is the mpmath implementation of span2000_check.py (written from
../shared/reference/nitrogen-span2000.json only, Span et al. 2000); the trapped-fluid balance and the
relief rule of docs/methods.md §3 ("Trapped charge", "Thermal relief") are written out here again, in
40-digit arithmetic with bracketing root finders, without any code of src/.

The unit: 1 L gas volume at 0 % fill (the gas-side stop is not reached), precharge 1450 psig at 70 °F,
0.2 L trapped line fluid, alpha = 8e-4 /K, K = 1.5 GPa, atmosphere 101.325 kPa. Charged to 3000 psig at
0 °C and trapped; warmed to 30 °C; relief at 3300 psig; cooled back to 0 °C; start energy to 1000 psig
(isentropic, return at atmospheric pressure).
Run: python3 tests/physics/crosscheck/relief_check.py (needs mpmath). Output in relief_check.out.
"""
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))
import mpmath as mp  # noqa: E402
from span2000_check import ATM, cK, fK, model, psig, topsig  # noqa: E402

p, u, s, rho = model(True)
V0, LINE, ALPHA, K = mp.mpf("1e-3"), mp.mpf("0.2e-3"), mp.mpf("8e-4"), mp.mpf("1.5e9")
n = rho(psig(1450), fK(70)) * V0
T0, T1 = cK(0), cK(30)

# The charged state c at the end of the recharge: 3000 psig at 0 °C.
PC = psig(3000)
VGC = n / rho(PC, T0)
VFC = V0 - VGC + LINE
VTOT = VGC + VFC


def trapped(tc, pc, vfc, t):
    """Pressure of the trapped charge at t: n/rho(P, t) + V_f,c(1 + alpha(t - T_c) - (P - P_c)/K) = V_total."""
    bal = lambda pa: n / rho(pa, t) + vfc * (1 + ALPHA * (t - tc) - (pa - pc) / K) - VTOT
    return mp.findroot(bal, (psig(1500), psig(5000)), solver="anderson")


def energy(vg1, t1):
    """Hydraulic energy of an isentropic discharge from gas volume vg1 at t1 to 1000 psig or V0."""
    r1 = n / vg1
    s1, u1 = s(r1, t1), u(r1, t1)
    r0 = n / V0
    t_v0 = mp.findroot(lambda t: s(r0, t) - s1, (mp.mpf(130), t1), solver="anderson")
    if p(r0, t_v0) > psig(1000):
        r2, t2 = r0, t_v0
    else:
        t2 = mp.findroot(lambda t: s(rho(psig(1000), t), t) - s1, (mp.mpf(130), t1), solver="anderson")
        r2 = rho(psig(1000), t2)
    v2 = n / r2
    return n * (u1 - u(r2, t2)) - ATM * (v2 - vg1)


def main():
    warm = trapped(T0, PC, VFC, T1)
    print(" warmed to 30 C, no relief (psig):", mp.nstr(topsig(warm), 6))
    # Relief at 3300 psig: the gas at the relief pressure and 30 °C, the fluid fills the rest.
    pr = psig(3300)
    vg_r = n / rho(pr, T1)
    vf_r = VTOT - vg_r
    relieved = VFC * (1 + ALPHA * (T1 - T0) - (pr - PC) / K) - vf_r
    print(" relieved at 30 C and 3300 psig (mL):", mp.nstr(relieved * 1e6, 4))
    cold = trapped(T1, pr, vf_r, T0)
    print(" cooled back to 0 C, reference = relief state (psig):", mp.nstr(topsig(cold), 6))
    # The alternative the model does not use: the recharge state kept as reference, with the fluid
    # amount that remains after the relief.
    vfc_kept = vf_r / (1 + ALPHA * (T1 - T0) - (pr - PC) / K)
    kept = trapped(T0, PC, vfc_kept, T0)
    print(" cooled back to 0 C, reference = recharge state (psig):", mp.nstr(topsig(kept), 6))
    print(" start energy from the charged state (kJ):", mp.nstr(energy(VGC, T0) / 1000, 4))
    vg_cold = n / rho(cold, T0)
    print(" start energy after the relief, cooled back (kJ):", mp.nstr(energy(vg_cold, T0) / 1000, 4))


if __name__ == "__main__":
    main()
