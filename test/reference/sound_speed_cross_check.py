#!/usr/bin/env python3
"""Independent published equations against Whence's sound-speed models, over each model's validity range:
seawater Mackenzie (1981) against UNESCO (Chen & Millero 1977, ITS-90 coefficients of Wong & Zhu 1995) and Coppens (1981);
fresh water Marczak (1997) against UNESCO at S = 0, P = 0; the humidity term of Cramer (1993) against an ideal-gas mixture.
Run: python3 test/reference/sound_speed_cross_check.py   (numpy only; the tests never run it)."""
import numpy as np

from speed_of_sound import cramer, mackenzie, marczak

# UNESCO equation (Chen & Millero 1977) with the ITS-90 coefficients of Wong & Zhu (1995), J. Acoust. Soc. Am. 97(3):1732-1736
# (coefficients from memory of the published table). T in deg C (ITS-90), S in PSU, P gauge pressure in bar.
C = [[1402.388, 5.03830, -5.81090e-2, 3.3432e-4, -1.47797e-6, 3.1419e-9],
     [0.153563, 6.8999e-4, -8.1829e-6, 1.3632e-7, -6.1260e-10],
     [3.1260e-5, -1.7111e-6, 2.5986e-8, -2.5353e-10, 1.0415e-12],
     [-9.7729e-9, 3.8513e-10, -2.3654e-12]]
A = [[1.389, -1.262e-2, 7.166e-5, 2.008e-6, -3.21e-8],
     [9.4742e-5, -1.2583e-5, -6.4928e-8, 1.0515e-8, -2.0142e-10],
     [-3.9064e-7, 9.1061e-9, -1.6009e-10, 7.994e-12],
     [1.100e-10, 6.651e-12, -3.391e-13]]
B = [[-1.922e-2, -4.42e-5], [7.3637e-5, 1.7950e-7]]
D = [1.727e-3, -7.9836e-6]


def poly(c, x):
    return sum(ci * x**i for i, ci in enumerate(c))


def unesco(t, s, p_bar):
    cw = sum(poly(C[k], t) * p_bar**k for k in range(4))
    a = sum(poly(A[k], t) * p_bar**k for k in range(4))
    b = sum(poly(B[k], t) * p_bar**k for k in range(2))
    d = D[0] + D[1] * p_bar
    return cw + a * s + b * s**1.5 + d * s**2


def saunders_pressure_bar(depth_m, latitude_deg=45.0):
    """Saunders (1981), J. Phys. Oceanogr. 11:573-574: depth in m -> gauge pressure (dbar), returned in bar."""
    c1 = (5.92 + 5.25 * np.sin(np.radians(latitude_deg))**2) * 1e-3
    dbar = ((1 - c1) - np.sqrt((1 - c1)**2 - 8.84e-6 * depth_m)) / 4.42e-6
    return dbar / 10.0


def unesco_at_depth(t, s, depth_m):
    return unesco(t, s, saunders_pressure_bar(depth_m))


def coppens(t_c, s, depth_m):
    """Coppens (1981), J. Acoust. Soc. Am. 69(3):862-863; valid 0..35 deg C, 0..45 ppt, 0..4000 m."""
    t = t_c / 10.0
    dk = depth_m / 1000.0
    c0 = 1449.05 + 45.7 * t - 5.21 * t**2 + 0.23 * t**3 + (1.333 - 0.126 * t + 0.009 * t**2) * (s - 35)
    return c0 + (16.23 + 0.253 * t) * dk + (0.213 - 0.1 * t) * dk**2 + (0.016 + 0.0002 * (s - 35)) * (s - 35) * t * dk


def salinity_slope(fn, t, s, d, h=0.01):
    return (fn(t, s + h, d) - fn(t, s - h, d)) / (2 * h)


def band(label, fn, depths, temps, sal=np.linspace(25.0, 40.0, 31)):
    tt, ss, dd = np.meshgrid(temps, sal, depths, indexing="ij")
    m = mackenzie(tt, ss, dd)
    r = fn(tt, ss, dd)
    slope = salinity_slope(mackenzie, tt, ss, dd) - salinity_slope(fn, tt, ss, dd)
    print(f"{label:58s} c: {(m - r).min():+.3f}..{(m - r).max():+.3f} m/s   dc/dS: {slope.min():+.4f}..{slope.max():+.4f} m/s/ppt")


def main():
    print("# single values (to check the TypeScript copies of the equations)")
    print(f"unesco 20 C, 35 PSU, 0 bar: {unesco(20.0, 35.0, 0.0):.6f} m/s; 10 C, 35 PSU, 4000 m: {unesco_at_depth(10.0, 35.0, 4000.0):.6f} m/s")
    print(f"saunders 45 deg, 4000 m: {saunders_pressure_bar(4000.0):.6f} bar")
    print(f"coppens 10 C, 30 ppt, 2000 m: {coppens(10.0, 30.0, 2000.0):.6f} m/s")

    print("# Mackenzie minus UNESCO (Saunders 1981 at 45 deg), S 25..40 ppt, T in 0.5 K steps, 21 depths per band")
    full_t = np.linspace(-2.0, 30.0, 65)
    cold_t = np.linspace(-2.0, 4.0, 13)
    band("surface, -2..30 C", unesco_at_depth, np.array([0.0]), full_t)
    band("0..1000 m, -2..30 C", unesco_at_depth, np.linspace(0, 1000, 21), full_t)
    band("0..2000 m, -2..30 C", unesco_at_depth, np.linspace(0, 2000, 21), full_t)
    band("0..4000 m, -2..30 C", unesco_at_depth, np.linspace(0, 4000, 21), full_t)
    band("0..8000 m, -2..30 C", unesco_at_depth, np.linspace(0, 8000, 21), full_t)
    band("0..8000 m, -2..4 C (deep ocean water)", unesco_at_depth, np.linspace(0, 8000, 21), cold_t)

    print("# Mackenzie minus Coppens over Coppens's range intersected with Mackenzie's: 0..30 C, 25..40 ppt, 0..4000 m")
    copp_t = np.linspace(0.0, 30.0, 61)
    band("surface, 0..30 C", coppens, np.array([0.0]), copp_t)
    band("0..4000 m, 0..30 C", coppens, np.linspace(0, 4000, 21), copp_t)

    print("# Marczak minus UNESCO at S = 0, P = 0 over 0..40 C (UNESCO's range), 0.1 K steps")
    t = np.linspace(0.0, 40.0, 401)
    diff = marczak(t) - unesco(t, 0.0, 0.0)
    print(f"{diff.min():+.4f}..{diff.max():+.4f} m/s")

    print("# Cramer humid-minus-dry increment over an ideal-gas mixture's (Cp = 7R/2 dry air, 4R water vapour)")
    R_MA, R_MW = 28.9647e-3, 18.01528e-3
    worst = 0.0
    for tc in np.linspace(0.0, 30.0, 31):
        for rh in (25.0, 50.0, 75.0, 100.0):
            for kpa in (60.0, 101.325, 110.0):
                T = tc + 273.15
                psv = np.exp(1.2811805e-5 * T**2 - 1.9509874e-2 * T + 34.04926034 - 6.3536311e3 / T)
                f = 1.00062 + 3.14e-8 * kpa * 1e3 + 5.6e-7 * tc**2
                xw = rh / 100 * f * psv / (kpa * 1e3)
                molar = (1 - xw) * R_MA + xw * R_MW
                cp = (1 - xw) * 3.5 + xw * 4.0
                ratio = np.sqrt((cp / (cp - 1)) / 1.4 * R_MA / molar)
                dry = cramer(tc, 0.0, kpa, 400.0)
                ideal_increment = dry * (ratio - 1)
                cramer_increment = cramer(tc, rh, kpa, 400.0) - dry
                worst = max(worst, abs(ideal_increment / cramer_increment - 1))
    print(f"largest |ideal/Cramer - 1| of the increment: {worst:.4f}")


if __name__ == "__main__":
    main()
