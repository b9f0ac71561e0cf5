"""Tests of the Python client against a running Correlary (CORRELARY_URL, CORRELARY_TOKEN), and of its
Retry-After handling against a local stand-in server. Run by tests/integration/python-client.test.ts."""
import http.server
import json
import os
import threading
import unittest
import warnings

import hashlib
import hmac
import time

from correlary import Client, CorrelaryError, CorrelaryRangeWarning, verify_webhook

URL = os.environ["CORRELARY_URL"]
TOKEN = os.environ["CORRELARY_TOKEN"]


class AgainstTheApp(unittest.TestCase):
    def setUp(self):
        self.c = Client(URL, TOKEN)

    def test_single_with_units_names_version_and_hash(self):
        r = self.c.evaluate("air-viscosity-sutherland", {"T": (15, "degC")})
        # U.S. Standard Atmosphere 1976, sea level: 1.7894e-5 Pa s
        self.assertAlmostEqual(r["outputs"]["mu"], 1.7894e-5, delta=2e-9)
        self.assertRegex(r["contentHash"], r"^[0-9a-f]{64}$")
        self.assertEqual(r["warnings"], [])

    def test_outputs_in_the_unit_asked_for(self):
        r = self.c.evaluate("air-viscosity-sutherland", {"T": (15, "degC")}, output_units={"mu": "mPa s"})
        # the same sea-level value as above, 1 mPa s = 1e-3 Pa s (SI prefixes, common practice)
        self.assertAlmostEqual(r["outputs"]["mu"], 1.7894e-2, delta=2e-6)
        self.assertEqual(r["units"]["mu"], "mPa s")

    def test_rows_in_order(self):
        rs = self.c.evaluate_rows("pipe-turbulent-gnielinski", [{"Re_D": 1e4, "Pr": 3}, {"Re_D": 1e5, "Pr": 3}])
        self.assertEqual(len(rs), 2)
        self.assertLess(rs[0]["outputs"]["Nu_D"], rs[1]["outputs"]["Nu_D"])

    def test_range_warning_is_a_python_warning_too(self):
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            r = self.c.evaluate("air-viscosity-sutherland", {"T": 100})
        self.assertEqual(r["warnings"][0]["symbol"], "T")
        self.assertTrue(any(issubclass(w.category, CorrelaryRangeWarning) for w in caught))

    def test_errors_carry_code_message_details(self):
        with self.assertRaises(CorrelaryError) as e:
            self.c.evaluate("pipe-turbulent-gnielinski", {"Re_D": "fast", "Pr": 3})
        self.assertEqual(e.exception.status, 422)
        self.assertEqual(e.exception.code, "invalid:inputs")
        self.assertEqual(e.exception.details["issues"][0]["path"], "inputs.Re_D")
        with self.assertRaises(CorrelaryError) as e:
            self.c.evaluate("no-such-correlation", {"x": 1})
        self.assertEqual(e.exception.code, "not_found:correlation")

    def test_pinned_version_and_etag(self):
        v = self.c.version("friction-factor-colebrook", 1)
        again = self.c.version("friction-factor-colebrook", 1)
        self.assertEqual(v["contentHash"], again["contentHash"])
        r = self.c.evaluate("friction-factor-colebrook", {"Re_D": 1e5, "eps_D": 1e-4}, version=1)
        self.assertEqual((r["version"], r["contentHash"]), (1, v["contentHash"]))

    def test_search_iterates_all_pages(self):
        slugs = [i["slug"] for i in self.c.search(q="plate", page_size=5)]
        self.assertGreater(len(slugs), 5)
        self.assertEqual(len(slugs), len(set(slugs)))

    def test_template(self):
        r = self.c.run_template("flat-plate-forced-convection-air", {"T_inf": (20, "degC"), "T_s": (60, "degC"), "p": (1, "atm"), "u_inf": 3, "L": 0.5, "W": 0.3})
        self.assertEqual([s["key"] for s in r["steps"]][:2], ["film-temperature", "air-properties"])
        self.assertGreater(r["outputs"]["h"], 0)


class WebhookSignature(unittest.TestCase):
    """The receiver-side check, against a delivery signed here with the documented scheme (HMAC-SHA-256 of "<t>.<body>")."""

    secret = "whsec_test"
    body = b'{"event":"version.withdrawn","occurredAt":"2026-12-01T10:00:00.000Z","data":{"slug":"x","version":2}}'

    def headers(self, t, body=None):
        sig = "v1=" + hmac.new(self.secret.encode(), str(t).encode() + b"." + (body or self.body), hashlib.sha256).hexdigest()
        return {"Correlary-Webhook-Timestamp": str(t), "Correlary-Webhook-Signature": sig, "Correlary-Webhook-Id": "41"}

    def test_accepts_a_fresh_signed_delivery(self):
        t = int(time.time())
        self.assertEqual(verify_webhook(self.secret, self.headers(t), self.body)["data"]["version"], 2)

    def test_refuses_a_replay_tampering_and_a_wrong_secret(self):
        t = int(time.time()) - 3600
        with self.assertRaisesRegex(ValueError, "stale"):
            verify_webhook(self.secret, self.headers(t), self.body)
        t = int(time.time())
        with self.assertRaisesRegex(ValueError, "signature"):
            verify_webhook(self.secret, self.headers(t), self.body.replace(b"2}", b"3}"))
        with self.assertRaisesRegex(ValueError, "signature"):
            verify_webhook("whsec_other", self.headers(t), self.body)


class RetryAfter(unittest.TestCase):
    """A stand-in server answering 429 (Retry-After: 0) a given number of times before 200."""

    def serve(self, limited):
        state = {"calls": 0}

        class Handler(http.server.BaseHTTPRequestHandler):
            def do_POST(self):
                state["calls"] += 1
                self.rfile.read(int(self.headers.get("Content-Length", 0)))
                if state["calls"] <= limited:
                    body = json.dumps({"error": {"code": "rate_limited:requests", "message": "slow down"}}).encode()
                    self.send_response(429)
                    self.send_header("Retry-After", "0")
                else:
                    body = json.dumps({"slug": "x", "version": 1, "contentHash": "0" * 64, "outputs": {"y": 1.0}, "warnings": []}).encode()
                    self.send_response(200)
                self.send_header("Content-Type", "application/json")
                self.send_header("Content-Length", str(len(body)))
                self.end_headers()
                self.wfile.write(body)

            def log_message(self, *args):
                pass

        server = http.server.HTTPServer(("127.0.0.1", 0), Handler)
        threading.Thread(target=server.serve_forever, daemon=True).start()
        self.addCleanup(server.shutdown)
        return f"http://127.0.0.1:{server.server_port}", state

    def test_backs_off_and_succeeds(self):
        url, state = self.serve(limited=2)
        r = Client(url, "t", max_retries=3).evaluate("x", {"a": 1})
        self.assertEqual(r["outputs"]["y"], 1.0)
        self.assertEqual(state["calls"], 3)

    def test_gives_up_after_the_bounded_retries(self):
        url, state = self.serve(limited=10)
        with self.assertRaises(CorrelaryError) as e:
            Client(url, "t", max_retries=2).evaluate("x", {"a": 1})
        self.assertEqual(e.exception.status, 429)
        self.assertEqual(state["calls"], 3)


if __name__ == "__main__":
    unittest.main(verbosity=2)
