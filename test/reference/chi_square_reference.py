#!/usr/bin/env python3
"""Reference values for test/core/locate/chiSquare.test.ts and specialFunctions.test.ts: chi-square quantiles and
tails, F upper tails, log-gamma and the regularised incomplete gamma and beta functions (scipy.stats / scipy.special).
Run: python3 test/reference/chi_square_reference.py   (scipy; the tests never run it)."""
from scipy import special, stats

print('chi-square quantiles (check-values.md table, plus extra dof)')
for dof, p in [(2, 0.3935), (2, 0.5), (2, 0.95), (2, 0.99), (3, 0.5), (3, 0.95), (3, 0.99),
               (1, 0.95), (1, 0.99), (1, 0.999), (4, 0.05), (10, 0.5), (30, 0.999), (0.5, 0.3), (100, 0.01)]:
    print(f'  dof {dof:>5}, p {p:<6}: {stats.chi2.ppf(p, dof):.12g}')
print('2 dof, p = 1 - exp(-1/2) (one sigma in 2-D):', stats.chi2.ppf(1 - 2.718281828459045 ** -0.5, 2))

print('chi-square upper tails')
for dof, x in [(1, 3.841458820694124), (4, 13.2767), (26, 45.6417), (10, 0.5), (3, 100.0)]:
    print(f'  dof {dof}, x {x}: {stats.chi2.sf(x, dof):.12g}')

print('F upper tails')
for d1, d2, f in [(1, 3, 10.128), (1, 10, 4.9646), (1, 25, 30.0), (2, 7, 0.5)]:
    print(f'  F({d1},{d2}) > {f}: {stats.f.sf(f, d1, d2):.12g}')

print('log-gamma')
for x in [0.5, 1.0, 3.5, 10.0, 171.5, 0.01]:
    print(f'  lgamma({x}) = {special.gammaln(x):.15g}')
print('regularised lower gamma P(a, x)')
for a, x in [(0.5, 0.1), (1.5, 2.0), (5.0, 3.0), (10.0, 20.0), (50.0, 45.0)]:
    print(f'  P({a}, {x}) = {special.gammainc(a, x):.15g}, Q = {special.gammaincc(a, x):.15g}')
print('regularised incomplete beta I_x(a, b)')
for x, a, b in [(0.3, 0.5, 1.5), (0.9, 5.0, 2.0), (0.5, 10.0, 10.0), (0.01, 2.0, 30.0)]:
    print(f'  I({x}; {a}, {b}) = {special.betainc(a, b, x):.15g}')
