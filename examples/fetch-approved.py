#!/usr/bin/env python3
"""Fetch every approved design's build sheet (PDF) and SPICE netlist into a folder.

    SENSEWRIGHT_URL=http://localhost:3000 SENSEWRIGHT_TOKEN=swt_... python3 examples/fetch-approved.py out/

Standard library only. A read token is enough (create one on /account); a maker's token sees
exactly the approved designs.
"""
import json
import os
import re
import sys
import urllib.error
import urllib.request

URL = os.environ.get("SENSEWRIGHT_URL", "http://localhost:3000").rstrip("/")
TOKEN = os.environ.get("SENSEWRIGHT_TOKEN")


def get(path):
    request = urllib.request.Request(URL + path, headers={"Authorization": "Bearer " + TOKEN})
    try:
        with urllib.request.urlopen(request, timeout=60) as response:
            return response.read()
    except urllib.error.HTTPError as error:
        try:
            message = json.loads(error.read()).get("message", "")
        except ValueError:
            message = ""
        sys.exit(f"GET {path} -> {error.code}: {message}")


def main():
    if not TOKEN:
        sys.exit("set SENSEWRIGHT_TOKEN to a token from /account")
    out = sys.argv[1] if len(sys.argv) > 1 else "approved"
    os.makedirs(out, exist_ok=True)
    designs = json.loads(get("/api/designs"))["designs"]
    approved = [d for d in designs if d["status"] == "approved"]
    if not approved:
        sys.exit("no approved design in this team yet")
    for design in approved:
        stem = re.sub(r"[^A-Za-z0-9_-]+", "-", design["name"]).strip("-") or design["id"]
        stem = f"{stem}-rev{design['revision']}"
        sheet = get(f"/api/designs/{design['id']}/build-sheet")
        netlist = get(f"/api/designs/{design['id']}/netlist")
        with open(os.path.join(out, stem + ".pdf"), "wb") as f:
            f.write(sheet)
        with open(os.path.join(out, stem + ".cir"), "wb") as f:
            f.write(netlist)
        print(f"{design['name']} (revision {design['revision']}): {stem}.pdf {len(sheet)} bytes, {stem}.cir")


if __name__ == "__main__":
    main()
