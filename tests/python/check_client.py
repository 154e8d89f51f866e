"""Checks static/bulkpad.py against a running Bulkpad: python3 tests/python/check_client.py <baseUrl> <key> [<tight key>]

A plain script with asserts (no test framework), run by tests/api/python-client.test.ts against the built test
server. <key> is a member's key with the default budget; <tight key>, when given, is one with a budget of
2 requests a minute, to see the client report a rate limit. Prints one line per check; exits non-zero on the
first failure.
"""

import math
import os
import sys

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "static"))

import bulkpad  # noqa: E402
from bulkpad import Bulkpad, BulkpadError  # noqa: E402

base, key = sys.argv[1], sys.argv[2]
tight = sys.argv[3] if len(sys.argv) > 3 else None


def check(name):
    print("ok -", name, flush=True)


bp = Bulkpad(base, key, arrays=False)

# who the key is
me = bp.me()
assert me["role"] in ("member", "admin"), me
check("the key signs in as its member")

# one line, one scalar
results = bp.eval("darea l=0.3 o=2")
assert len(results) == 1, results
r = results[0]
assert r["kind"] == "scalar" and isinstance(r["value"], float) and r["order"] == 2, r
assert math.isfinite(r["value"]), r
check("eval answers a scalar")

# the same line at a higher order moves the number only a little: a real evaluation, not a canned answer
exact = bp.eval("darea l=0.3 o=exact")[0]
assert exact["order"] == "exact", exact
assert exact["value"] != r["value"] and abs(exact["value"] - r["value"]) < 0.1 * abs(exact["value"]), (exact, r)
check("eval at another order gives a nearby, different number")

# a language error carries its message, span and hint
try:
    bp.eval("darea l=")
    raise AssertionError("a broken line did not raise")
except BulkpadError as e:
    assert e.status == 400, e.status
    assert e.message and isinstance(e.message, str), e.message
    assert isinstance(e.start, int) and isinstance(e.end, int) and 0 <= e.start <= e.end <= len("darea l=") + 1, (e.start, e.end)
    assert str(e).startswith(e.message)
    assert e.hint is None or isinstance(e.hint, str)
check("a language error raises BulkpadError with message, start, end, hint")

try:
    bp.eval("drea l=0.3")
    raise AssertionError("an unknown verb did not raise")
except BulkpadError as e:
    assert e.status == 400 and e.start == 0 and e.end >= 4, (e.status, e.start, e.end)
    assert e.hint, "an unknown verb comes with a hint"
check("an unknown verb points at the verb and hints")

# a sweep as columns (plain lists without numpy)
cols = bp.sweep("darea l=0.1..0.5:5 o=1,2,exact")
assert list(cols) == ["l", "o1", "o2", "exact"], list(cols)
assert all(isinstance(v, list) and len(v) == 5 for v in cols.values()), cols
assert [round(x, 12) for x in cols["l"]] == [0.1, 0.2, 0.3, 0.4, 0.5], cols["l"]
# the exact column is the same quantity as eval's exact scalar at l=0.3
assert abs(cols["exact"][2] - exact["value"]) <= 1e-9 * abs(exact["value"]), (cols["exact"][2], exact["value"])
check("sweep returns the table's columns by name")

try:
    bp.sweep("darea l=0.3")
    raise AssertionError("a sweep of one point did not complain")
except BulkpadError as e:
    assert "table" in e.message, e.message
check("sweep of a line without a table says so")

if bulkpad._np is not None:
    arrays = Bulkpad(base, key, arrays=None).sweep("darea l=0.1..0.5:5 o=1,2,exact")
    assert type(arrays["o2"]).__name__ == "ndarray" and arrays["o2"].shape == (5,), arrays
    assert arrays["o2"].dtype.kind == "f", arrays["o2"].dtype
    assert all(abs(a - b) <= 1e-12 * abs(b) for a, b in zip(arrays["exact"].tolist(), cols["exact"])), arrays
    check("with numpy, columns are float arrays")
else:
    print("skip - numpy is not installed: the array form of sweep was not checked", flush=True)

# progress of a long line through the streaming endpoint
seen = []
streamed = bp.sweep("darea l=0.05..1:40 o=1,2,exact", progress=lambda done, total: seen.append((done, total)))
assert seen, "no progress was reported"
assert all(0 < d <= t for d, t in seen), seen
assert seen[-1][0] == seen[-1][1], seen
assert [d for d, _ in seen] == sorted(d for d, _ in seen), seen
assert len(streamed["l"]) == 40, len(streamed["l"])
check("progress arrives through the stream (%d report(s), last %s/%s)" % (len(seen), seen[-1][0], seen[-1][1]))

try:
    bp.eval("darea l=", progress=lambda d, t: None)
    raise AssertionError("a broken streamed line did not raise")
except BulkpadError as e:
    assert e.status == 400 and isinstance(e.start, int), (e.status, e.start)
check("a language error in a streamed line raises the same way")

# a pad: lines become steps
pad = bp.new_pad("From the Python check")
first = pad.eval("darea l=0.3 o=2")
assert abs(first[0]["value"] - r["value"]) < 1e-12, (first, r)
pad.eval("zstar l=0.3")
try:
    pad.eval("darea l=")
    raise AssertionError("a broken line in a pad did not raise")
except BulkpadError as e:
    assert e.status == 400
steps = bp.pad(pad.id).steps()
assert [s["n"] for s in steps] == [1, 2], steps
assert [s["input"] for s in steps] == ["darea l=0.3 o=2", "zstar l=0.3"], steps
assert steps[0]["results"][0]["value"] == first[0]["value"], steps[0]
check("pad(id).steps() lists the lines evaluated into it, failed lines left out")

# a snapshot replays without drift
snap = pad.share(note="python check")
transcript = snap.transcript()
assert len(transcript["steps"]) == 2, transcript
replayed = bp.snapshot(snap.slug).replay()
assert [s["n"] for s in replayed["steps"]] == [1, 2], replayed
assert replayed["drifted"] == 0 and replayed["failed"] == 0, replayed
assert all(s["drift"] is False for s in replayed["steps"]), replayed
check("snapshot(slug).replay() finds no drift")

# refusals other than language errors
try:
    bp.pad("no-such-pad").steps()
    raise AssertionError("a missing pad did not raise")
except BulkpadError as e:
    assert e.status == 404 and e.start is None, (e.status, e.start)
check("a missing pad raises with status 404")

try:
    Bulkpad(base, "bpk_not-a-key-at-all-000000000").eval("darea l=0.3")
    raise AssertionError("a wrong key did not raise")
except BulkpadError as e:
    assert e.status == 401, e.status
check("a wrong key raises with status 401")

if tight:
    slow = Bulkpad(base, tight, retries=0, arrays=False)
    slow.me()
    slow.me()
    try:
        slow.me()
        raise AssertionError("a key over its budget was not refused")
    except BulkpadError as e:
        assert e.status == 429 and isinstance(e.retry_after, int) and 1 <= e.retry_after <= 60, (e.status, e.retry_after)
    check("a key over its budget raises 429 with retry_after")

print("all checks passed", flush=True)
