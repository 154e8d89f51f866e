"""Bulkpad from Python: one module, standard library only (numpy is used for sweep columns when present).

    from bulkpad import Bulkpad
    bp = Bulkpad("https://bulkpad.example.org", "bpk_...")   # a key from the Keys page
    print(bp.eval("darea l=0.5")[0]["value"])

    cols = bp.sweep("darea l=0.05..1:100 o=1,2,exact")      # {"l": [...], "o1": [...], "o2": [...], "exact": [...]}
    bp.eval("darea l=0.05..1:400 o=6", progress=lambda done, total: print(done, "/", total))
    for step in bp.pad("pad-id").steps(): print(step["n"], step["input"])
    print(bp.snapshot("slug").replay()["drifted"])

A language error in a line raises BulkpadError with .message, .start, .end (the characters of the line it
points at) and .hint; any other refusal raises it with .status (and .retry_after for 429 and 503).
The whole API is described at <url>/api/openapi.json and, readably, at <url>/help/api.
"""

import json
import time
import urllib.error
import urllib.parse
import urllib.request

try:  # columns become arrays when numpy is there; plain lists otherwise
    import numpy as _np
except ImportError:  # pragma: no cover - depends on the machine
    _np = None

__all__ = ["Bulkpad", "BulkpadError", "Pad", "Snapshot"]
__version__ = "1"


class BulkpadError(Exception):
    """A refused request. For a language error, start/end index the offending characters of the line."""

    def __init__(self, message, status=None, start=None, end=None, hint=None, retry_after=None, body=None):
        super().__init__(message)
        self.message = message
        self.status = status
        self.start = start
        self.end = end
        self.hint = hint
        self.retry_after = retry_after
        self.body = body

    def __str__(self):
        where = "" if self.start is None else " (characters %s-%s)" % (self.start, self.end)
        hint = "" if not self.hint else "; hint: %s" % self.hint
        return "%s%s%s" % (self.message, where, hint)


def _error_of(status, body, retry_after=None):
    err = body.get("error") if isinstance(body, dict) else None
    if not isinstance(err, dict):
        return BulkpadError("HTTP %s: %s" % (status, str(body)[:200]), status=status, retry_after=retry_after, body=body)
    return BulkpadError(
        err.get("message", "HTTP %s" % status),
        status=status,
        start=err.get("start"),
        end=err.get("end"),
        hint=err.get("hint"),
        retry_after=err.get("retryAfter", retry_after),
        body=body,
    )


class Bulkpad:
    """A connection to one Bulkpad server as the owner of one key.

    retries: how many times a 429 or 503 (busy) answer is waited out (its Retry-After, at most max_wait seconds)
    before BulkpadError is raised. arrays: None uses numpy for sweep columns when importable; False never does.
    """

    def __init__(self, url, key, timeout=300, retries=2, max_wait=60, arrays=None):
        self.url = url.rstrip("/")
        self.key = key
        self.timeout = timeout
        self.retries = retries
        self.max_wait = max_wait
        self.arrays = (_np is not None) if arrays is None else bool(arrays and _np is not None)

    # --- plumbing -------------------------------------------------------------------------------------------
    def _open(self, method, path, body=None, accept="application/json"):
        data = None if body is None else json.dumps(body).encode("utf-8")
        headers = {"Authorization": "Bearer " + self.key, "Accept": accept, "User-Agent": "bulkpad.py/" + __version__}
        # every write declares JSON: the server refuses other writes (its cross-site guard)
        if method != "GET":
            headers["Content-Type"] = "application/json"
            if data is None:
                data = b"{}"
        req = urllib.request.Request(self.url + path, data=data, method=method, headers=headers)
        for attempt in range(self.retries + 1):
            try:
                return urllib.request.urlopen(req, timeout=self.timeout)
            except urllib.error.HTTPError as e:
                raw = e.read()
                try:
                    parsed = json.loads(raw.decode("utf-8"))
                except ValueError:
                    parsed = raw.decode("utf-8", "replace")
                wait = e.headers.get("Retry-After")
                wait = int(wait) if wait and wait.isdigit() else None
                if e.code in (429, 503) and wait is not None and wait <= self.max_wait and attempt < self.retries:
                    time.sleep(wait)
                    continue
                raise _error_of(e.code, parsed, wait) from None

    def request(self, method, path, body=None):
        """Any API route (see /api/openapi.json): the parsed JSON answer; BulkpadError when it is refused."""
        with self._open(method, path, body) as r:
            return json.loads(r.read().decode("utf-8"))

    # --- evaluation -----------------------------------------------------------------------------------------
    def eval(self, line, pad=None, progress=None):
        """Evaluates one line and returns its results (a list of dicts, API.md's Result shapes).

        Without pad nothing is stored; with a pad id the line becomes that pad's next step. progress, when given,
        is called as progress(done, total) while a sweep runs (the streaming form of the same request).
        """
        return self.evaluate(line, pad=pad, progress=progress)["results"]

    def evaluate(self, line, pad=None, progress=None):
        """Like eval, but the whole reply: results, bulk, ms, and step when the line went into a pad."""
        body = {"input": line}
        if pad is not None:
            body["pad"] = pad.id if isinstance(pad, Pad) else pad
        if progress is None:
            return self.request("POST", "/api/eval", body)
        with self._open("POST", "/api/eval", body, accept="application/x-ndjson") as r:
            reply = None
            for raw in r:
                raw = raw.strip()
                if not raw:
                    continue
                msg = json.loads(raw.decode("utf-8"))
                if "progress" in msg:
                    progress(msg["progress"]["done"], msg["progress"]["total"])
                elif "reply" in msg:
                    reply = msg["reply"]
        if reply is None:
            raise BulkpadError("the stream ended without a reply")
        status, answer = reply.get("status", 200), reply.get("body", {})
        if status >= 400 or not answer.get("ok", False):
            retry = (reply.get("headers") or {}).get("retry-after")
            raise _error_of(status, answer, int(retry) if retry and str(retry).isdigit() else None)
        return answer

    def sweep(self, line, pad=None, progress=None):
        """Evaluates a line that answers a table (a list or range of l, orders…) and returns its columns by name.

        With numpy each column is an array (strings and gaps become nan in numeric columns); without, a list.
        """
        results = self.eval(line, pad=pad, progress=progress)
        tables = [r for r in results if r.get("kind") == "table"]
        if not tables:
            kinds = ", ".join(r.get("kind", "?") for r in results) or "nothing"
            raise BulkpadError("the line answered %s, not a table; sweep a list or range, e.g. l=0.1..1:50" % kinds)
        return self.columns(tables[-1])

    def columns(self, table):
        """A table result as {column name: values}."""
        names = table["columns"]
        cols = {name: [row[i] if i < len(row) else None for row in table["rows"]] for i, name in enumerate(names)}
        if not self.arrays:
            return cols
        out = {}
        for name, values in cols.items():
            if all(v is None or isinstance(v, (int, float)) for v in values):
                out[name] = _np.array([_np.nan if v is None else v for v in values], dtype=float)
            else:
                out[name] = _np.array(values, dtype=object)
        return out

    # --- pads, snapshots ------------------------------------------------------------------------------------
    def pads(self):
        """Your own pads, newest first."""
        return self.request("GET", "/api/pads")["pads"]

    def new_pad(self, title=None):
        """A fresh pad in the default bulk."""
        made = self.request("POST", "/api/pads", {} if title is None else {"title": title})
        return Pad(self, made["pad"]["id"])

    def pad(self, pad_id):
        return Pad(self, pad_id)

    def snapshot(self, slug):
        return Snapshot(self, slug)

    def me(self):
        return self.request("GET", "/api/auth/me")["user"]


class Pad:
    """One pad: its steps, and lines evaluated into it."""

    def __init__(self, client, pad_id):
        self.client = client
        self.id = pad_id

    def get(self):
        """The pad and its steps as the API answers them."""
        return self.client.request("GET", "/api/pads/" + urllib.parse.quote(self.id, safe=""))

    def steps(self):
        """The steps, in order: each with n, input, status, results, error, name, hidden, version."""
        return self.get()["steps"]

    def eval(self, line, progress=None):
        """Evaluates the line as this pad's next step; its results."""
        return self.client.eval(line, pad=self.id, progress=progress)

    def sweep(self, line, progress=None):
        return self.client.sweep(line, pad=self.id, progress=progress)

    def share(self, note=None, expires_in_days=None):
        """A snapshot of the pad as it is now, behind a read-only link."""
        body = {}
        if note is not None:
            body["note"] = note
        if expires_in_days is not None:
            body["expiresInDays"] = expires_in_days
        made = self.client.request("POST", "/api/pads/%s/share" % urllib.parse.quote(self.id, safe=""), body)
        return Snapshot(self.client, made["slug"])

    def __repr__(self):
        return "Pad(%r)" % self.id


class Snapshot:
    """A shared snapshot (a transcript): read it, or replay it now and see what drifted."""

    def __init__(self, client, slug):
        self.client = client
        self.slug = slug

    def transcript(self):
        return self.client.request("GET", "/api/t/" + urllib.parse.quote(self.slug, safe=""))

    def replay(self):
        """{steps: [{n, drift, failed, delta, results?, error?}], drifted, failed, skipped}."""
        return self.client.request("POST", "/api/t/%s/replay" % urllib.parse.quote(self.slug, safe=""))

    def __repr__(self):
        return "Snapshot(%r)" % self.slug
