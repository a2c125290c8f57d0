#!/usr/bin/python3
"""Reference values for core/stats/within.test.ts: the covariates' coefficients by ordinary least squares with one
dummy per condition (numpy lstsq on the full design, no within-centring), and the covariate-adjusted condition-means
line computed step by step (demo data). Run: /usr/bin/python3 within_reference.py
"""
import numpy as np
from scipy import stats

# Demo data: four dosage conditions (ln f), four embryos each; stage in minutes; batch A or B (base A).
cond = np.repeat([0, 1, 2, 3], 4)
lnf = np.log(np.array([0.5, 1.0, 2.0, 4.0]))[cond]
stage = np.array([10, 14, 18, 25, 12, 15, 22, 30, 20, 24, 27, 35, 28, 33, 36, 41], dtype=float)
batch_b = np.array([0, 1, 0, 1, 0, 0, 1, 1, 1, 0, 1, 0, 1, 1, 0, 0], dtype=float)
y = np.array([0.301, 0.322, 0.310, 0.341, 0.351, 0.360, 0.368, 0.383, 0.402, 0.411, 0.425, 0.430,
              0.455, 0.470, 0.468, 0.480])

# OLS with one dummy per condition (no common intercept) plus the two covariate terms.
D = np.eye(4)[cond]
X = np.column_stack([D, stage, batch_b])
beta, *_ = np.linalg.lstsq(X, y, rcond=None)
e = y - X @ beta
dof = len(y) - X.shape[1]
s2 = float(e @ e) / dof
cov = s2 * np.linalg.inv(X.T @ X)
print('beta stage', repr(beta[4]), 'batchB', repr(beta[5]))
print('se stage', repr(np.sqrt(cov[4, 4])), 'batchB', repr(np.sqrt(cov[5, 5])), 'cov', repr(cov[4, 5]))
print('s2', repr(s2), 'dof', dof)

# Adjusted positions at the covariates' overall means, then the line through the four adjusted means.
b = beta[4:6]
Z = np.column_stack([stage, batch_b])
y_adj = y - (Z - Z.mean(axis=0)) @ b
xm = np.log(np.array([0.5, 1.0, 2.0, 4.0]))
ym = np.array([y_adj[cond == j].mean() for j in range(4)])
A = np.column_stack([np.ones(4), xm])
coef, *_ = np.linalg.lstsq(A, ym, rcond=None)
r = ym - A @ coef
se_means = np.sqrt(float(r @ r) / 2 * np.linalg.inv(A.T @ A)[1, 1])
c = (xm - xm.mean()) / ((xm - xm.mean())**2).sum()
d = c @ (np.array([Z[cond == j].mean(axis=0) for j in range(4)]) - Z.mean(axis=0))
se = np.sqrt(se_means**2 + d @ cov[4:6, 4:6] @ d)
print('adjusted slope', repr(coef[1]), 'intercept', repr(coef[0]))
print('se means only', repr(se_means), 'se', repr(se))
t = stats.t.ppf(0.975, 2)
print('ci', repr(coef[1] - t * se), repr(coef[1] + t * se))
# Unadjusted condition-means slope, for contrast.
print('unadjusted slope', repr(np.polyfit(xm, [y[cond == j].mean() for j in range(4)], 1)[0]))
