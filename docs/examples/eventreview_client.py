#!/usr/bin/env python3
"""Use the EventReview API from Python's standard library alone (no packages to install).

    export EVENTREVIEW_URL=https://review.example.org      # the server
    export EVENTREVIEW_TOKEN=ert_...                        # an API token (scopes cases:open, evidence:add, cases:read)
    python3 eventreview_client.py open ER-C-0900 1400000000.25 plot.png   # open a case, add a note and a file
    python3 eventreview_client.py verdicts ER-C-0900                      # every item's state and computation verdicts

Every refusal is an RFC 9457 problem (application/problem+json) naming what was wrong; this script prints it and
stops. A refused request has changed nothing, so it is safe to correct and send again (opening a case is idempotent
on the candidate id).
"""
import json
import os
import sys
import urllib.error
import urllib.parse
import urllib.request
import uuid

BASE = os.environ.get("EVENTREVIEW_URL", "http://127.0.0.1:5080").rstrip("/")
TOKEN = os.environ.get("EVENTREVIEW_TOKEN", "")


def call(method, path, body=None, content_type="application/json"):
    """One API call; returns (status, parsed JSON). Exits with the problem's title and detail on a refusal."""
    data = json.dumps(body).encode("utf-8") if body is not None and content_type == "application/json" else body
    request = urllib.request.Request(BASE + path, data=data, method=method)
    request.add_header("Authorization", "Bearer " + TOKEN)
    request.add_header("Accept", "application/json")
    if data is not None:
        request.add_header("Content-Type", content_type)
    try:
        with urllib.request.urlopen(request, timeout=60) as response:
            return response.status, json.load(response)
    except urllib.error.HTTPError as error:
        problem = json.load(error)
        sys.exit(f"{method} {path}: {error.code} {problem.get('title')}: {problem.get('detail')}")


def multipart(file_name, file_bytes, description):
    """A multipart/form-data body with the fields the upload takes: 'file' and an optional 'description'."""
    boundary = uuid.uuid4().hex
    parts = [
        f'--{boundary}\r\nContent-Disposition: form-data; name="description"\r\n\r\n{description}\r\n'.encode("utf-8"),
        f'--{boundary}\r\nContent-Disposition: form-data; name="file"; filename="{os.path.basename(file_name)}"\r\n'
        f"Content-Type: application/octet-stream\r\n\r\n".encode("utf-8") + file_bytes + b"\r\n",
        f"--{boundary}--\r\n".encode("utf-8"),
    ]
    return b"".join(parts), f"multipart/form-data; boundary={boundary}"


def case_id(candidate):
    _, page = call("GET", "/api/cases?q=" + urllib.parse.quote(candidate))
    for c in page["items"]:
        if c["candidateId"] == candidate:
            return c["id"]
    sys.exit(f"No case for candidate {candidate}.")


def open_case(candidate, gps_time, file_name):
    _, sites = call("GET", "/api/sites")
    arrivals = [{"site": s["code"], "gpsTime": gps_time, "snr": 8.0} for s in sites[:2]]
    status, case = call("POST", "/api/cases", {"candidateId": candidate, "gpsTime": gps_time, "search": "my-pipeline",
                                               "arrivals": arrivals, "checklist": "rapid-triage"})
    print(f"case {case['id']} for {candidate}: {'opened' if status == 201 else 'already open'} ({case['state']})")
    item = case["items"][0]["key"]
    _, note = call("POST", f"/api/cases/{case['id']}/items/{item}/notes", {"text": "Raised by **my-pipeline**; plots attached."})
    print(f"note {note['id']} on {item}: sha256 {note['sha256'][:12]}..., item fingerprint {note['fingerprint'][:12]}...")
    with open(file_name, "rb") as f:
        body, content_type = multipart(file_name, f.read(), "Pipeline plot")
    _, added = call("POST", f"/api/cases/{case['id']}/items/{item}/attachments", body, content_type)
    print(f"file {added['fileName']} ({added['sizeBytes']} bytes) on {item}: sha256 {added['sha256'][:12]}...")


def verdicts(candidate):
    cid = case_id(candidate)
    _, case = call("GET", f"/api/cases/{cid}")
    print(f"{candidate} (case {cid}): {case['state']}")
    for item in case["items"]:
        _, records = call("GET", f"/api/cases/{cid}/items/{item['key']}/computations")
        _, signed = call("GET", f"/api/cases/{cid}/items/{item['key']}/signoffs")
        print(f"  {item['key']}: {item['state']}, {signed['currentSignOffs']}/{signed['requiredSignOffs']} current sign-off(s)")
        for r in records["items"]:
            if r["current"]:
                print(f"    {r['kind']}: {r['verdict']} - {r['summary']}")


if __name__ == "__main__":
    if len(sys.argv) == 5 and sys.argv[1] == "open":
        open_case(sys.argv[2], float(sys.argv[3]), sys.argv[4])
    elif len(sys.argv) == 3 and sys.argv[1] == "verdicts":
        verdicts(sys.argv[2])
    else:
        sys.exit(__doc__)
