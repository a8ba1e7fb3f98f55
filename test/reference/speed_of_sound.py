#!/usr/bin/env python3
"""Reference values for test/core/medium: speed of sound in air (Cramer 1993, ideal gas),
fresh water (Marczak 1997) and seawater (Mackenzie 1981), with dc/dT by central difference.
Run: python3 test/reference/speed_of_sound.py   (numpy only; the tests never run it)."""
import numpy as np

# Cramer (1993), J. Acoust. Soc. Am. 93:2510, coefficients as in IEC 61094-2 Annex F.
A = np.array([
    331.5024, 0.603055, -0.000528, 51.471935, 0.1495874, -0.000782,
    -1.82e-7, 3.73e-8, -2.93e-10, -85.20931, -0.228525, 5.91e-5,
    -2.835149, -2.15e-13, 29.179762, 0.000486,
], dtype=np.float64)


def cramer(t_c, rh_percent=0.0, p_kpa=101.325, co2_ppm=400.0):
    t = np.float64(t_c)
    p = np.float64(p_kpa) * 1e3
    T = t + 273.15
    psv = np.exp(1.2811805e-5 * T**2 - 1.9509874e-2 * T + 34.04926034 - 6.3536311e3 / T)
    f = 1.00062 + 3.14e-8 * p + 5.6e-7 * t**2
    xw = (rh_percent / 100.0) * f * psv / p
    xc = co2_ppm * 1e-6
    a = A
    return (a[0] + a[1] * t + a[2] * t**2
            + (a[3] + a[4] * t + a[5] * t**2) * xw
            + (a[6] + a[7] * t + a[8] * t**2) * p
            + (a[9] + a[10] * t + a[11] * t**2) * xc
            + a[12] * xw**2 + a[13] * p**2 + a[14] * xc**2 + a[15] * xw * p * xc)


def ideal_gas(t_c):
    return 331.3 * np.sqrt(1.0 + np.float64(t_c) / 273.15)


# Marczak (1997), J. Acoust. Soc. Am. 102:2776; coefficients of t^0..t^5.
MARCZAK = np.array([1.402385e3, 5.038813, -5.799136e-2, 3.287156e-4, -1.398845e-6, 2.787860e-9])


def marczak(t_c):
    return np.polynomial.polynomial.polyval(np.float64(t_c), MARCZAK)


def mackenzie(t, s=35.0, d=0.0):
    t, s, d = np.float64(t), np.float64(s), np.float64(d)
    return (1448.96 + 4.591 * t - 5.304e-2 * t**2 + 2.374e-4 * t**3 + 1.340 * (s - 35.0)
            + 1.630e-2 * d + 1.675e-7 * d**2 - 1.025e-2 * t * (s - 35.0) - 7.139e-13 * t * d**3)


def central(fn, t, h=1e-3):
    return (fn(t + h) - fn(t - h)) / (2.0 * h)


def main():
    print("# check values (check-values.md)")
    print(f"cramer 0 C, 0 %RH, 101.325 kPa, 314 ppm : {cramer(0.0, 0.0, 101.325, 314.0):.6f} m/s")
    print(f"cramer 20 C, 0 %RH, 101.325 kPa, 314 ppm: {cramer(20.0, 0.0, 101.325, 314.0):.6f} m/s")
    print(f"cramer 20 C, 50 %RH, 101.325 kPa, 400 ppm: {cramer(20.0, 50.0, 101.325, 400.0):.6f} m/s")
    print(f"marczak 20 C: {marczak(20.0):.6f} m/s   25 C: {marczak(25.0):.6f} m/s")
    print(f"mackenzie 25 C, 35 ppt, 1000 m: {mackenzie(25.0, 35.0, 1000.0):.6f} m/s")
    print(f"ideal gas 0 C: {ideal_gas(0.0):.6f}   20 C: {ideal_gas(20.0):.6f} m/s")

    print("# defaults (0 % RH, 101.325 kPa, 400 ppm) and sensitivities dc/dT at constant RH")
    for label, fn, t in [
        ("cramer 20 C dry", lambda x: cramer(x), 20.0),
        ("cramer 20 C 50 %RH", lambda x: cramer(x, 50.0), 20.0),
        ("cramer 30 C 100 %RH", lambda x: cramer(x, 100.0), 30.0),
        ("ideal gas 20 C", ideal_gas, 20.0),
        ("marczak 20 C", marczak, 20.0),
        ("mackenzie 10 C 35 ppt 0 m", lambda x: mackenzie(x, 35.0, 0.0), 10.0),
    ]:
        c = fn(t)
        dc = central(fn, t)
        print(f"{label:28s} c = {c:.6f} m/s  dc/dT = {dc:.6f} m/s/K  ({100 * dc / c:.4f} %/K)")

    print("# other facts used in the tests")
    T = 293.15
    psv = np.exp(1.2811805e-5 * T**2 - 1.9509874e-2 * T + 34.04926034 - 6.3536311e3 / T)
    print(f"saturation vapour pressure at 20 C (Cramer 1993): {psv:.3f} Pa")
    t = np.linspace(0.0, 95.0, 95001)
    c = marczak(t)
    print(f"marczak maximum: {c.max():.4f} m/s at {t[c.argmax()]:.3f} C")

    print("# cramer (dry, 101.325 kPa) minus ideal gas over 0..30 C, 0.01 K steps")
    t = np.linspace(0.0, 30.0, 3001)
    for ppm in (0.0, 314.0, 400.0, 10000.0):
        diff = cramer(t, 0.0, 101.325, ppm) - ideal_gas(t)
        print(f"CO2 {ppm:7.0f} ppm: min {diff.min():+.6f}  max {diff.max():+.6f}  max|diff| {np.abs(diff).max():.6f} m/s")
    print("# over the whole Cramer pressure range 60..110 kPa, 400 ppm, dry")
    diffs = [cramer(t, 0.0, p, 400.0) - ideal_gas(t) for p in np.linspace(60.0, 110.0, 51)]
    print(f"max|diff| {np.abs(np.array(diffs)).max():.6f} m/s")


if __name__ == "__main__":
    main()
