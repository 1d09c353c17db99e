#!/usr/bin/python3
"""Bins fixture.csv with pandas `DataFrame.resample` on a tz-aware local index, per person:
daily bins starting at 04:00 local (`resample('D', offset='4h')`) and hourly bins
(`resample('H')`). Per bin: entries, words, and for each score the word-weighted mean
(sum of words*x over entries with a value / sum of their words), the entry mean and the sum
(`min_count=1`, so an empty bin is NaN, never 0). Writes expected-daily.csv and
expected-hourly.csv (hourly rows only within the three UTC days around each change date, to
keep the file small) and versions.txt.
Run: /usr/bin/python3 make-expected.py   (Debian python3-pandas)
"""
import platform
import pandas as pd

SCORES = ["fix.valence", "fix.worry"]
CHANGE_DATES = ["2026-03-08", "2026-03-29", "2026-10-25", "2026-11-01"]

df = pd.read_csv("fixture.csv", dtype={"entry_id": str, "person": str})
df["time"] = pd.to_datetime(df["time_utc"], utc=True)


def fmt(x):
    return "" if pd.isna(x) else repr(float(x))


def bins(person_rows, zone, rule, offset=None):
    local = person_rows.set_index(person_rows["time"].dt.tz_convert(zone)).sort_index()
    frame = pd.DataFrame({"entries": 1, "words": local["words"]}, index=local.index)
    for s in SCORES:
        has = local[s].notna()
        frame[s] = local[s]
        frame[s + ":wx"] = (local["words"] * local[s]).where(has)
        frame[s + ":w"] = local["words"].where(has)
    r = frame.resample(rule, offset=offset) if offset else frame.resample(rule)
    out = pd.DataFrame({"entries": r["entries"].sum(), "words": r["words"].sum()})
    for s in SCORES:
        wx = r[s + ":wx"].sum(min_count=1)
        w = r[s + ":w"].sum(min_count=1)
        out[s + ".weighted"] = (wx / w).where(w > 0)
        out[s + ".mean"] = r[s].mean()
        out[s + ".sum"] = r[s].sum(min_count=1)
    # Bin ends are pandas' own next bin edge (empty when the bin is the person's last).
    starts = list(out.index)
    out["bin_end"] = [starts[i + 1].isoformat() if i + 1 < len(starts) else "" for i in range(len(starts))]
    return out


def write(name, frames):
    cols = ["entries", "words"] + [f"{s}.{k}" for s in SCORES for k in ("weighted", "mean", "sum")]
    with open(name, "w", newline="\n") as f:
        f.write("person,bin_start,bin_end," + ",".join(cols) + "\n")
        for person, out in frames:
            for start, row in out.iterrows():
                f.write(",".join([person, start.isoformat(), row["bin_end"], str(int(row["entries"])), str(int(row["words"]))]
                                 + [fmt(row[c]) for c in cols[2:]]) + "\n")


daily, hourly = [], []
for person, rows in df.groupby("person", sort=True):
    zone = rows["zone"].iloc[0]
    daily.append((person, bins(rows, zone, "D", offset="4h")))
    h = bins(rows, zone, "H")
    keep = pd.Series(False, index=h.index)
    for d in CHANGE_DATES:
        lo = pd.Timestamp(d, tz="UTC") - pd.Timedelta(days=1)
        keep |= (h.index >= lo) & (h.index < lo + pd.Timedelta(days=3))
    hourly.append((person, h[keep.values]))

write("expected-daily.csv", daily)
write("expected-hourly.csv", hourly)
with open("versions.txt", "w") as f:
    f.write(f"python {platform.python_version()}\npandas {pd.__version__}\n")
print(sum(len(o) for _, o in daily), "daily bins,", sum(len(o) for _, o in hourly), "hourly bins")
