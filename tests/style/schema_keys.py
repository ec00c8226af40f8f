#!/usr/bin/env python3
"""Prints every property name the style schema defines, one per line, sorted.

Usage: schema_keys.py SCHEMA. The docs test checks each one is documented in docs/style.md.
"""
import json
import sys


def keys(node, out):
    if isinstance(node, dict):
        for name, sub in node.get("properties", {}).items():
            out.add(name)
            keys(sub, out)
        for k, v in node.items():
            if k != "properties":
                keys(v, out)
    elif isinstance(node, list):
        for v in node:
            keys(v, out)


if __name__ == "__main__":
    with open(sys.argv[1], encoding="utf-8") as f:
        found = set()
        keys(json.load(f), found)
    print("\n".join(sorted(found)))
