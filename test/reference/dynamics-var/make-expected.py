"""Expected values for test/dynamics/var1.test.ts, from statsmodels (Debian python3-statsmodels).

Run with /usr/bin/python3 make-expected.py inside this folder. Writes:
  fixture.csv          person,t,lag_valid,a,b  (invented bivariate VAR(1) series; empty = missing)
  expected-var.csv     statsmodels VAR(1) with a constant on person P1's mean-centred series
  expected-pooled.csv  statsmodels OLS with person dummies on the lag pairs of all persons
  versions.txt
"""
import numpy as np
import pandas as pd
import statsmodels
import statsmodels.api as sm
from statsmodels.tsa.api import VAR

rng = np.random.default_rng(20240611)
A = np.array([[0.45, 0.20], [-0.15, 0.30]])
rows = []
for person, n in (("P1", 150), ("P2", 60), ("P3", 45)):
    x = np.zeros((n, 2))
    x[0] = rng.normal(size=2)
    for t in range(1, n):
        x[t] = A @ x[t - 1] + rng.normal(scale=[1.0, 0.7])
    x += np.array([3.0, -1.0]) if person != "P2" else np.array([1.0, 2.0])
    for t in range(n):
        a, b = x[t]
        # P2 and P3 have missing bins and a break (a night of excluded hours); P1 is complete.
        if person != "P1" and t % 11 == 5:
            a = np.nan
        if person == "P3" and t % 13 == 7:
            b = np.nan
        rows.append({"person": person, "t": t, "a": a, "b": b, "break": person != "P1" and t % 20 == 0 and t > 0})
df = pd.DataFrame(rows)
# lag_valid: t > 0, not a break, previous bin observed (both variables, as in the series file the
# bin is missing when it has no value).
df["observed"] = df["a"].notna() & df["b"].notna()
df["lag_valid"] = 0
for person, g in df.groupby("person"):
    idx = g.index.to_list()
    for k, i in enumerate(idx):
        if k > 0 and not df.at[i, "break"] and df.at[idx[k - 1], "observed"]:
            df.at[i, "lag_valid"] = 1
df[["person", "t", "lag_valid", "a", "b"]].to_csv("fixture.csv", index=False, float_format="%.12g")

# 1) VAR(1) of P1 (complete, so statsmodels' VAR sees exactly our lag pairs), on mean-centred data.
p1 = df[df.person == "P1"][["a", "b"]]
p1c = p1 - p1.mean()
res = VAR(p1c.to_numpy()).fit(1, trend="c")
out = []
names = ["(intercept)", "a", "b"]
for j, outcome in enumerate(["a", "b"]):
    for i, predictor in enumerate(names):
        out.append({"outcome": outcome, "predictor": predictor, "estimate": res.params[i, j], "se": res.bse[i, j], "t": res.tvalues[i, j], "p": res.pvalues[i, j]})
pd.DataFrame(out).to_csv("expected-var.csv", index=False, float_format="%.12g")

# 2) Pooled fixed effects: OLS of x_t on x_{t-1} with person dummies, over valid lag pairs only.
pairs = []
for person, g in df.groupby("person"):
    g = g.reset_index(drop=True)
    for k in range(1, len(g)):
        cur, prev = g.loc[k], g.loc[k - 1]
        if cur.lag_valid == 1 and cur.observed and prev.observed:
            pairs.append({"person": person, "a": cur.a, "b": cur.b, "a_lag": prev.a, "b_lag": prev.b})
pairs = pd.DataFrame(pairs)
dummies = pd.get_dummies(pairs.person, dtype=float)
X = pd.concat([pairs[["a_lag", "b_lag"]], dummies], axis=1)
out = []
for outcome in ["a", "b"]:
    fit = sm.OLS(pairs[outcome], X).fit()
    for predictor, name in (("a_lag", "a"), ("b_lag", "b")):
        out.append({"outcome": outcome, "predictor": name, "estimate": fit.params[predictor], "se": fit.bse[predictor], "t": fit.tvalues[predictor], "p": fit.pvalues[predictor], "n": int(fit.nobs), "df": int(fit.df_resid)})
pd.DataFrame(out).to_csv("expected-pooled.csv", index=False, float_format="%.12g")

with open("versions.txt", "w") as f:
    f.write(f"statsmodels {statsmodels.__version__}\npandas {pd.__version__}\nnumpy {np.__version__}\n")
