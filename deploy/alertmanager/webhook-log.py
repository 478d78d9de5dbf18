#!/usr/bin/env python3
"""Demo Alertmanager receiver for docker-compose.yml: prints every notification it receives, one line per
alert, and keeps nothing. Standard library only; listens on the compose network (no published port).
Read the alerts with: docker compose logs -f webhook-log"""
import json
import os
import sys
from http.server import BaseHTTPRequestHandler, HTTPServer

MAX_BODY = 1 << 20


class Handler(BaseHTTPRequestHandler):
    def do_POST(self):
        length = int(self.headers.get("Content-Length") or 0)
        if length <= 0 or length > MAX_BODY:
            self.send_response(413 if length > MAX_BODY else 400)
            self.end_headers()
            return
        try:
            body = json.loads(self.rfile.read(length))
        except ValueError:
            self.send_response(400)
            self.end_headers()
            return
        for alert in body.get("alerts", []):
            labels = alert.get("labels", {})
            annotations = alert.get("annotations", {})
            print(
                "%s %s %s [%s] %s | %s | runbook: %s"
                % (
                    alert.get("startsAt", ""),
                    alert.get("status", "").upper(),
                    labels.get("alertname", ""),
                    labels.get("severity", ""),
                    annotations.get("summary", ""),
                    annotations.get("description", ""),
                    annotations.get("runbook_url", ""),
                ),
                flush=True,
            )
        self.send_response(200)
        self.end_headers()

    def do_GET(self):  # health check
        self.send_response(200)
        self.end_headers()
        self.wfile.write(b"ok\n")

    def log_message(self, fmt, *args):  # no access log: the alert lines are the output
        pass


if __name__ == "__main__":
    address = os.environ.get("WEBHOOK_LOG_ADDRESS", "127.0.0.1")
    port = int(os.environ.get("WEBHOOK_LOG_PORT", "9095"))
    print("webhook-log: listening on %s:%d" % (address, port), file=sys.stderr, flush=True)
    HTTPServer((address, port), Handler).serve_forever()
