#!/usr/bin/env python3
"""Test vectors of lexichron's shard assignment, computed with Python's hashlib (not with the
code under test): shard = first 8 bytes of SHA-256(b"lexichron shard v1\\0" + UTF-8 person id),
big-endian unsigned, modulo N. Run: python3 test/shard/vectors/shard-vectors.py > test/shard/vectors/shard-vectors.json"""
import hashlib
import json

LABEL = b"lexichron shard v1\x00"
PERSONS = ["p01", "p02", "p26", "alice-demo", "", "Zoë", "人", "🐝 hive", "p" * 300,
           "k3f9c0a1b2", "participant 0042", "a,b\"c"]
COUNTS = [1, 2, 3, 7, 10, 1000]

rows = []
for person in PERSONS:
    digest = hashlib.sha256(LABEL + person.encode("utf-8")).digest()
    value = int.from_bytes(digest[:8], "big")
    rows.append({"person": person, "first8": digest[:8].hex(), "shards": {str(n): value % n for n in COUNTS}})
print(json.dumps({"source": "python3 hashlib.sha256", "label": "lexichron shard v1\\u0000", "vectors": rows}, ensure_ascii=False, indent=1))
