#!/usr/bin/python3
"""Reference values for core/stats/line-fits.test.ts, computed independently with numpy matrix algebra and
scipy.stats distributions (demo data; York's test data from York 1966). Run: /usr/bin/python3 line_fits_reference.py
"""
import numpy as np
from scipy import stats

# Demo data: four dosage conditions (ln f), three embryos each; boundary positions in x/EL.
x = np.log(np.repeat([0.5, 1.0, 2.0, 4.0], 3))
y = np.array([0.301, 0.322, 0.296, 0.351, 0.360, 0.338, 0.392, 0.421, 0.405, 0.455, 0.470, 0.430])
X = np.column_stack([np.ones_like(x), x])

# OLS with HC3 (MacKinnon & White 1985): (X'X)^-1 X' diag(e^2/(1-h)^2) X (X'X)^-1.
xtx_inv = np.linalg.inv(X.T @ X)
beta = xtx_inv @ X.T @ y
e = y - X @ beta
h = np.einsum('ij,jk,ik->i', X, xtx_inv, X)
cov_hc3 = xtx_inv @ X.T @ np.diag(e**2 / (1 - h)**2) @ X @ xtx_inv
print('hc3 slope', repr(beta[1]), 'intercept', repr(beta[0]))
print('hc3 slope_se', repr(np.sqrt(cov_hc3[1, 1])), 'intercept_se', repr(np.sqrt(cov_hc3[0, 0])))
print('hc3 p', repr(2 * stats.t.sf(abs(beta[1] / np.sqrt(cov_hc3[1, 1])), len(y) - 2)))

# Lack-of-fit F test: pure error from the group means.
rss = float(e @ e)
groups = np.unique(x)
pure = sum(float(((y[x == g] - y[x == g].mean())**2).sum()) for g in groups)
k, n = len(groups), len(y)
F = ((rss - pure) / (k - 2)) / (pure / (n - k))
print('lof F', repr(F), 'p', repr(stats.f.sf(F, k - 2, n - k)))

# Random-intercept line through the condition means (method-of-moments tau^2, Knapp-Hartung variance), for the
# data above and for the same data with a shared offset per condition (demo data: +0.02, -0.015, +0.01, -0.02).
def random_intercept(y, label):
    means = np.array([y[x == g].mean() for g in groups])
    v = np.array([y[x == g].var(ddof=1) / (x == g).sum() for g in groups])
    Xg = np.column_stack([np.ones(k), groups])
    W = np.diag(1 / v)
    A = np.linalg.inv(Xg.T @ W @ Xg)
    P = W - W @ Xg @ A @ Xg.T @ W
    Q = float(means @ P @ means)
    tau2 = max(0.0, (Q - (k - 2)) / np.trace(P))
    Ws = np.diag(1 / (v + tau2))
    As = np.linalg.inv(Xg.T @ Ws @ Xg)
    b = As @ Xg.T @ Ws @ means
    r = means - Xg @ b
    s2 = float(r @ Ws @ r) / (k - 2)
    se = np.sqrt(s2 * np.diag(As))
    tq = stats.t.ppf(0.975, k - 2)
    print(label + ' tau2', repr(tau2), 'Q', repr(Q), 'pQ', repr(stats.chi2.sf(Q, k - 2)))
    print(label + ' slope', repr(b[1]), 'se', repr(se[1]), 'ci', repr(b[1] - tq * se[1]), repr(b[1] + tq * se[1]))
    print(label + ' intercept', repr(b[0]), 'se', repr(se[0]))


random_intercept(y, 're')
random_intercept(y + np.repeat([0.02, -0.015, 0.01, -0.02], 3), 're-offset')

# York's fit (York et al. 2004 algorithm) on York's 1966 test data: Pearson's points with York's weights.
xp = np.array([0.0, 0.9, 1.8, 2.6, 3.3, 4.4, 5.2, 6.1, 6.5, 7.4])
yp = np.array([5.9, 5.4, 4.4, 4.6, 3.5, 3.7, 2.8, 2.8, 2.4, 1.5])
wx = np.array([1000, 1000, 500, 800, 200, 80, 60, 20, 1.8, 1.0])
wy = np.array([1, 1.8, 4, 8, 20, 20, 70, 70, 100, 500.0])
bb = np.polyfit(xp, yp, 1)[0]
for _ in range(200):
    Wi = wx * wy / (wx + bb**2 * wy)
    xb, yb = (Wi * xp).sum() / Wi.sum(), (Wi * yp).sum() / Wi.sum()
    U, V = xp - xb, yp - yb
    beta_i = Wi * (U / wy + bb * V / wx)
    bb = (Wi * beta_i * V).sum() / (Wi * beta_i * U).sum()
Wi = wx * wy / (wx + bb**2 * wy)
xb, yb = (Wi * xp).sum() / Wi.sum(), (Wi * yp).sum() / Wi.sum()
aa = yb - bb * xb
xadj = xb + Wi * ((xp - xb) / wy + bb * (yp - yb) / wx)
ub = (Wi * xadj).sum() / Wi.sum()
sb = np.sqrt(1 / (Wi * (xadj - ub)**2).sum())
sa = np.sqrt(1 / Wi.sum() + ub**2 * sb**2)
print('york slope', repr(bb), 'intercept', repr(aa), 'slope_se', repr(sb), 'intercept_se', repr(sa))
