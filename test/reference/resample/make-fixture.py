#!/usr/bin/python3
"""Writes fixture.csv: invented scored entries (the columns `lexichron score` writes) for four
persons in two zones with daylight-saving changes, spread over the days around the EU changes
(2026-03-29, 2026-10-25) and the US changes (2026-03-08, 2026-11-01), plus entries placed exactly
on and just before the 04:00 local day start. Deterministic (seeded). Run: /usr/bin/python3 make-fixture.py
"""
import random
from datetime import datetime, timedelta, timezone
from zoneinfo import ZoneInfo

rng = random.Random(20260329)
persons = [("b1", "Europe/Brussels"), ("b2", "Europe/Brussels"), ("n1", "America/New_York"), ("n2", "America/New_York")]
dates = ["2026-03-08", "2026-03-29", "2026-10-25", "2026-11-01"]
rows = []
for person, zone in persons:
    tz = ZoneInfo(zone)
    instants = set()
    for d in dates:
        day = datetime.fromisoformat(d).replace(tzinfo=timezone.utc)
        lo = day - timedelta(days=1)
        # Random instants over three UTC days around the change date.
        for _ in range(rng.randint(18, 30)):
            instants.add(lo + timedelta(minutes=rng.randrange(3 * 24 * 60), seconds=rng.randrange(60)))
        # On the local day start (04:00), one millisecond before it, and at 01:30 local.
        for hh, mm, us in ((4, 0, 0), (3, 59, 999000), (1, 30, 0)):
            local = datetime.fromisoformat(d).replace(hour=hh, minute=mm, second=59 if us else 0, microsecond=us, tzinfo=tz)
            instants.add(local.astimezone(timezone.utc))
    for i, t in enumerate(sorted(instants)):
        words = rng.choice([0, 1, 3, 5, 8, 12, 20, 35])
        valence = "" if rng.random() < 0.2 else f"{rng.uniform(-5, 5):.4f}"
        worry = rng.choice([0, 0, 0, 1, 1, 2, 3])
        local = t.astimezone(ZoneInfo(zone))
        rows.append([f"{person}-{i:03d}", person, t.strftime("%Y-%m-%dT%H:%M:%S.") + f"{t.microsecond // 1000:03d}Z", zone,
                     local.isoformat(timespec="milliseconds"), str(words), valence, str(rng.randint(0, 3)), str(worry), str(worry)])
with open("fixture.csv", "w", newline="\n") as f:
    f.write("entry_id,person,time_utc,zone,time_local,words,fix.valence,fix.valence.n,fix.worry,fix.worry.n\n")
    for r in rows:
        f.write(",".join(r) + "\n")
print(len(rows), "entries")
