#!/usr/bin/env python3
"""Posts a finished sweep from a probe-station computer to Rhotrace.

Uses only Python's standard library (3.8 or later). The station token is read from the
environment, never from the command line (other users of the computer can read command lines):

    export RHOTRACE_URL=https://rhotrace.lab.example
    export RHOTRACE_STATION_TOKEN=rts_...
    python3 station_client.py --wafer 42 --method four-point export.csv

The Idempotency-Key is derived from the wafer and the file's SHA-256, so sending the same file
again (after a lost answer, a crash, a reboot) can never store it twice: Rhotrace answers the
first answer again. Network failures, 409 (a post with this key is still being stored), 429 and
5xx answers are retried with the same key, waiting as Retry-After says.

Exit status: 0 stored (or already stored), 1 refused (the message says why), 2 gave up retrying.
"""
import argparse
import hashlib
import json
import os
import sys
import time
import urllib.error
import urllib.request
import uuid

RETRIED_STATUSES = {409, 429, 500, 502, 503, 504}


def idempotency_key(wafer_id, data):
    """The same wafer and file always give the same key."""
    return "wafer-%d-sha256-%s" % (wafer_id, hashlib.sha256(data).hexdigest())


def multipart(fields, file_name, data):
    """A multipart/form-data body: the text fields, then the file in the field "file"."""
    boundary = "rhotrace-" + uuid.uuid4().hex
    parts = []
    for name, value in fields.items():
        parts.append(
            ('--%s\r\nContent-Disposition: form-data; name="%s"\r\n\r\n%s\r\n'
             % (boundary, name, value)).encode("utf-8"))
    safe_name = os.path.basename(file_name).replace('"', "_")
    parts.append(
        ('--%s\r\nContent-Disposition: form-data; name="file"; filename="%s"\r\n'
         "Content-Type: text/csv\r\n\r\n" % (boundary, safe_name)).encode("utf-8"))
    parts.append(data)
    parts.append(("\r\n--%s--\r\n" % boundary).encode("utf-8"))
    return b"".join(parts), "multipart/form-data; boundary=" + boundary


def post_sweep(base_url, token, wafer_id, file_name, data, fields, key, attempts, wait_s):
    """Posts until stored or refused; returns (status, answer)."""
    body, content_type = multipart(dict(fields, waferId=str(wafer_id)), file_name, data)
    url = base_url.rstrip("/") + "/api/station/sweeps"
    for attempt in range(1, attempts + 1):
        request = urllib.request.Request(url, data=body, method="POST", headers={
            "Authorization": "Bearer " + token,
            "Idempotency-Key": key,
            "Content-Type": content_type,
            "Accept": "application/json",
        })
        retry_after = None
        try:
            with urllib.request.urlopen(request, timeout=120) as response:
                answer = json.loads(response.read().decode("utf-8"))
                answer["replayed"] = response.headers.get("Idempotent-Replayed") == "true"
                return response.status, answer
        except urllib.error.HTTPError as error:
            text = error.read().decode("utf-8", "replace")
            try:
                answer = json.loads(text)
            except ValueError:
                answer = {"error": {"code": "http", "message": text[:500]}}
            if error.code not in RETRIED_STATUSES:
                return error.code, answer
            retry_after = error.headers.get("Retry-After")
            reason = "HTTP %d: %s" % (error.code, answer.get("error", {}).get("message", ""))
        except (urllib.error.URLError, ConnectionError, TimeoutError, OSError) as error:
            reason = "network: %s" % (getattr(error, "reason", None) or error)
        if attempt == attempts:
            break
        delay = float(retry_after) if retry_after and retry_after.isdigit() else wait_s * 2 ** (attempt - 1)
        print("attempt %d failed (%s); retrying in %.1f s with the same key" % (attempt, reason, delay),
              file=sys.stderr)
        time.sleep(min(delay, 300))
    return None, {"error": {"code": "gave_up", "message": "no answer after %d attempts" % attempts}}


def main(argv=None):
    parser = argparse.ArgumentParser(description="Post a sweep to Rhotrace with a station token.")
    parser.add_argument("file", help="the probe-station export (CSV or text)")
    parser.add_argument("--wafer", type=int, required=True, help="the wafer's id in Rhotrace")
    parser.add_argument("--method", help="four-point, van-der-pauw, bar, resistivity, sheet-resistance "
                                         "(default: what the file says)")
    parser.add_argument("--spacing-cm", help="probe spacing, cm (default: the station's)")
    parser.add_argument("--thickness-cm", help="wafer thickness, cm (default: the wafer's or lot's)")
    parser.add_argument("--key", help="Idempotency-Key (default: from the wafer and the file)")
    parser.add_argument("--attempts", type=int, default=6, help="tries before giving up (default 6)")
    parser.add_argument("--wait", type=float, default=2.0, help="first wait between tries, s (default 2)")
    args = parser.parse_args(argv)

    base_url = os.environ.get("RHOTRACE_URL")
    token = os.environ.get("RHOTRACE_STATION_TOKEN")
    if not base_url or not token:
        print("Set RHOTRACE_URL and RHOTRACE_STATION_TOKEN first.", file=sys.stderr)
        return 1
    with open(args.file, "rb") as handle:
        data = handle.read()
    fields = {}
    if args.method:
        fields["method"] = args.method
    if args.spacing_cm:
        fields["spacingCm"] = args.spacing_cm
    if args.thickness_cm:
        fields["thicknessCm"] = args.thickness_cm
    key = args.key or idempotency_key(args.wafer, data)
    status, answer = post_sweep(base_url, token, args.wafer, args.file, data, fields, key,
                                args.attempts, args.wait)
    print(json.dumps({"status": status, "idempotencyKey": key, "answer": answer}))
    if status == 201:
        return 0
    return 2 if status is None else 1


if __name__ == "__main__":
    sys.exit(main())
