#!/usr/bin/env python3
"""Reference values for test/core/pipeline/pooledTiming.test.ts: the chi-square median on 3 degrees of freedom (the
residual sums are built around it), and the arrival sigma of two events under their band class's model,
sqrt((nu0 k^2 sigma^2 + RSS) / (nu0 + r)) with nu0 = 2 (scaled-inverse-chi-square prior, Gelman et al., BDA 3.3).
Run: python3 test/reference/band_class_pooling.py   (numpy/scipy; the tests never run it)."""
import numpy as np
from scipy import stats

DOF = 3
NU0 = 2
median = stats.chi2.median(DOF)
print(f'chi-square median, {DOF} dof: {median:.15g}')

# The test's events (numbered 0-20 at 2 kHz, 21-41 at 8 kHz): sigma_i = 2e-6 * (1 + i % 4) s,
# RSS_i = k^2 sigma_i^2 * median * FACTORS[i % 21] (10 below 1, 10 above).
FACTORS = [0.4, 0.5, 0.6, 0.7, 0.8, 0.85, 0.9, 0.95, 0.97, 0.99, 1.0, 1.01, 1.03, 1.05, 1.1, 1.2, 1.3, 1.4, 1.6, 1.8, 2.0]
for name, k, events in [('2 kHz class, k = 1', 1.0, (0, 20)), ('8 kHz class, k = 3', 3.0, (21, 41))]:
    for i in events:
        sigma = 2e-6 * (1 + i % 4)
        rss = k ** 2 * sigma ** 2 * median * FACTORS[i % 21]
        # at these factors the upper tails stay above 0.1 % (no event is its own population)
        assert stats.chi2.sf(rss / (k ** 2 * sigma ** 2), DOF) > 1e-3
        s = np.sqrt((NU0 * k ** 2 * sigma ** 2 + rss) / (NU0 + DOF))
        print(f'{name}, event {i}: arrival sigma {s:.12g} s')
