"""Correlary client: evaluate governed, pinned correlation versions and run calculation templates
from Python scripts and notebooks. One file, Python >= 3.9, standard library only.

    from correlary import Client
    c = Client("http://localhost:3000", token="crl_...")
    r = c.evaluate("pipe-turbulent-gnielinski", {"Re_D": 3e4, "Pr": (4.3, "1")})
    print(r["outputs"]["Nu_D"], r["version"], r["contentHash"])

Results are engineering estimates within the stated validity ranges, to be checked under the
applicable codes and by a responsible licensed engineer.
"""
import hashlib
import hmac
import json
import time
import urllib.error
import urllib.parse
import urllib.request
import warnings

__all__ = ["Client", "CorrelaryError", "CorrelaryRangeWarning", "verify_webhook"]
__version__ = "1.0.0"


class CorrelaryRangeWarning(UserWarning):
    """An input or intermediate value lies outside the published validity range (the value is still computed)."""


class CorrelaryError(Exception):
    """An error answer of the API: `status` (HTTP), `code` ("kind:subject"), `message`, `details`.

    >>> try:
    ...     client.evaluate("no-such-correlation", {"x": 1})
    ... except CorrelaryError as e:
    ...     print(e.status, e.code)
    404 not_found:correlation
    """

    def __init__(self, status, code, message, details=None):
        super().__init__(f"{status} {code}: {message}")
        self.status = status
        self.code = code
        self.message = message
        self.details = details


def _body(key, value, version, output_units=None):
    body = {key: value}
    if version is not None:
        body["version"] = int(version)
    if output_units:
        body["outputUnits"] = dict(output_units)
    return body


def _inputs(values):
    """Numbers stay numbers; (value, unit) pairs become {"value", "unit"}."""
    out = {}
    for k, v in values.items():
        if isinstance(v, tuple) and len(v) == 2:
            out[k] = {"value": float(v[0]), "unit": str(v[1])}
        else:
            out[k] = v
    return out


class Client:
    """A client for one Correlary server and one personal API token.

    >>> c = Client("http://localhost:3000", token="crl_...", max_retries=3)
    """

    def __init__(self, base_url, token, timeout=30.0, max_retries=3, warn=True):
        self.base_url = base_url.rstrip("/")
        self.token = token
        self.timeout = timeout
        self.max_retries = max_retries
        self.warn = warn
        self._etags = {}

    def _request(self, method, path, body=None, etag_key=None):
        data = None if body is None else json.dumps(body).encode("utf-8")
        for attempt in range(self.max_retries + 1):
            req = urllib.request.Request(self.base_url + path, data=data, method=method)
            req.add_header("Authorization", f"Bearer {self.token}")
            req.add_header("Accept", "application/json")
            if data is not None:
                req.add_header("Content-Type", "application/json")
            if etag_key and etag_key in self._etags:
                req.add_header("If-None-Match", self._etags[etag_key][0])
            try:
                with urllib.request.urlopen(req, timeout=self.timeout) as res:
                    text = res.read().decode("utf-8")
                    answer = json.loads(text) if text else None
                    if etag_key and res.headers.get("ETag"):
                        self._etags[etag_key] = (res.headers["ETag"], answer)
                    return answer
            except urllib.error.HTTPError as err:
                if err.code == 304 and etag_key in self._etags:
                    return self._etags[etag_key][1]
                if err.code in (429, 503) and attempt < self.max_retries:
                    # Honour Retry-After (bounded), then try again.
                    try:
                        wait = float(err.headers.get("Retry-After", "1"))
                    except ValueError:
                        wait = 1.0
                    time.sleep(min(max(wait, 0.0), 60.0))
                    continue
                text = err.read().decode("utf-8", "replace")
                try:
                    e = json.loads(text).get("error", {})
                except ValueError:
                    e = {}
                raise CorrelaryError(err.code, e.get("code", "http"), e.get("message", text[:200]), e.get("details")) from None
        raise CorrelaryError(429, "rate_limited:retries", f"still limited after {self.max_retries} retries")

    def _warn(self, ws):
        if self.warn:
            for w in ws or []:
                warnings.warn(w.get("message", ""), CorrelaryRangeWarning, stacklevel=3)

    def evaluate(self, slug, inputs, version=None, output_units=None):
        """Evaluates one input set; returns the answer (outputs, warnings, version, contentHash, units).

        output_units maps an output to the unit wanted, e.g. {"mu": "mPa s"}; the answer's "units" says which were used.

        >>> r = c.evaluate("cylinder-crossflow-churchill-bernstein", {"Re_D": 1e4, "Pr": 0.71})
        >>> r["outputs"]["Nu_D"]
        """
        body = _body("inputs", _inputs(inputs), version, output_units)
        answer = self._request("POST", f"/api/correlations/{urllib.parse.quote(slug)}/evaluate", body)
        self._warn(answer.get("warnings"))
        return answer

    def evaluate_rows(self, slug, rows, version=None, output_units=None):
        """Evaluates many input sets in one request (at most 10,000); returns the results in order.

        >>> rs = c.evaluate_rows("pipe-turbulent-gnielinski", [{"Re_D": 1e4, "Pr": 3}, {"Re_D": 1e5, "Pr": 3}])
        >>> [r["outputs"]["Nu_D"] for r in rs]
        """
        body = _body("rows", [_inputs(r) for r in rows], version, output_units)
        answer = self._request("POST", f"/api/correlations/{urllib.parse.quote(slug)}/evaluate", body)
        self._warn(answer.get("warnings"))
        for r in answer["results"]:
            self._warn(r.get("warnings"))
        return answer["results"]

    def run_template(self, slug, inputs, version=None, output_units=None):
        """Runs a calculation template for one input set; the answer holds every step.

        >>> r = c.run_template("flat-plate-forced-convection-air", {"T_inf": (20, "degC"), "T_s": (60, "degC"), "p": (1, "atm"), "u_inf": 3, "L": 0.5, "W": 0.3})
        >>> r["outputs"]["h"]
        """
        body = _body("inputs", _inputs(inputs), version, output_units)
        answer = self._request("POST", f"/api/templates/{urllib.parse.quote(slug)}/run", body)
        self._warn(answer.get("warnings"))
        return answer

    def correlation(self, slug):
        """One correlation with the versions you may see.

        >>> [v["version"] for v in c.correlation("friction-factor-colebrook")["versions"]]
        """
        return self._request("GET", f"/api/correlations/{urllib.parse.quote(slug)}")

    def version(self, slug, n):
        """One version (definition, check cases, validation, evidence); re-reads are answered from the ETag.

        >>> c.version("friction-factor-colebrook", 1)["contentHash"]
        """
        return self._request("GET", f"/api/correlations/{urllib.parse.quote(slug)}/versions/{int(n)}", etag_key=(slug, int(n)))

    def search(self, q=None, category=None, page_size=200):
        """Every correlation matching, across all pages.

        >>> [i["slug"] for i in c.search(q="flat plate", category="external-flow")]
        """
        page = 1
        while True:
            params = {"page": page, "pageSize": page_size}
            if q:
                params["q"] = q
            if category:
                params["category"] = category
            answer = self._request("GET", "/api/correlations?" + urllib.parse.urlencode(params))
            yield from answer["items"]
            if page * page_size >= answer["total"]:
                return
            page += 1


def verify_webhook(secret, headers, body, tolerance=300, now=None):
    """Check a webhook delivery from Correlary; returns the parsed event, or raises ValueError.

    `headers` is a mapping of the request headers (any case), `body` the raw request body (bytes or str).
    The signature is HMAC-SHA-256 of "<timestamp>.<body>" with the endpoint's secret; a timestamp more than
    `tolerance` seconds from now is refused (a captured request replayed later). Also remember the
    Correlary-Webhook-Id values you processed and ignore repeats.

    >>> event = verify_webhook(secret, request.headers, request.get_data())
    >>> event["event"], event["data"]["slug"]
    ('version.withdrawn', 'pipe-turbulent-gnielinski')
    """
    h = {k.lower(): v for k, v in dict(headers).items()}
    raw = body if isinstance(body, bytes) else body.encode("utf-8")
    try:
        timestamp = int(h["correlary-webhook-timestamp"])
        signature = h["correlary-webhook-signature"]
    except (KeyError, ValueError):
        raise ValueError("not a Correlary webhook: timestamp or signature header missing")
    if abs((time.time() if now is None else now) - timestamp) > tolerance:
        raise ValueError("stale webhook: the timestamp is more than %d s away" % tolerance)
    expected = "v1=" + hmac.new(secret.encode("utf-8"), str(timestamp).encode("ascii") + b"." + raw, hashlib.sha256).hexdigest()
    if not hmac.compare_digest(expected, signature):
        raise ValueError("bad webhook signature")
    return json.loads(raw.decode("utf-8"))
