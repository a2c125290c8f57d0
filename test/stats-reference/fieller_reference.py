# Reference values for Fieller's interval of a ratio a/b (independent estimates), computed without the closed form:
# the limits are the roots in rho of the defining quadratic (a - rho*b)^2 = t^2 (sa^2 + rho^2 sb^2) (Fieller 1954),
# found with numpy.roots; t from scipy.stats.t. Run with Debian's /usr/bin/python3 and paste the printed constants
# into core/stats/fieller.test.ts.
import numpy as np
from scipy import stats

CASES = [
    # a, sa, b, sb, dof, level  (demo data)
    (0.17, 0.0075, 0.19, 0.005, 10, 0.95),
    (0.30, 0.05, 0.20, 0.03, 5, 0.95),
    (-0.12, 0.04, 0.21, 0.06, 8, 0.90),
]

for a, sa, b, sb, dof, level in CASES:
    t = stats.t.ppf(1 - (1 - level) / 2, dof)
    # (b^2 - t^2 sb^2) rho^2 - 2ab rho + (a^2 - t^2 sa^2) = 0
    roots = np.sort(np.roots([b * b - t * t * sb * sb, -2 * a * b, a * a - t * t * sa * sa]).real)
    g = t * t * sb * sb / (b * b)
    print(f"[{a}, {sa}, {b}, {sb}, {dof}, {level}, {roots[0]!r}, {roots[1]!r}, {g!r}],")
