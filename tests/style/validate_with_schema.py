#!/usr/bin/env python3
"""Validates style files against styles/style.schema.json (JSON Schema draft 2020-12).

Usage: validate_with_schema.py SCHEMA FILE...
Prints one line per file, "FILE: valid" or "FILE: invalid: REASON", and exits 0 when every
file is valid, 1 when any is not, 3 when python3-yaml or python3-jsonschema is missing.
"""
import json
import sys

try:
    import jsonschema
    import yaml
except ImportError as e:  # the test reports this as a missing package, not a failure of styles
    print(f"missing python module: {e.name}", file=sys.stderr)
    sys.exit(3)


def main(argv):
    with open(argv[1], encoding="utf-8") as f:
        schema = json.load(f)
    jsonschema.Draft202012Validator.check_schema(schema)
    validator = jsonschema.Draft202012Validator(schema)
    all_valid = True
    for name in argv[2:]:
        with open(name, encoding="utf-8") as f:
            try:
                doc = yaml.safe_load(f)
            except yaml.YAMLError as e:
                print(f"{name}: invalid: YAML: {str(e).splitlines()[0]}")
                all_valid = False
                continue
        errors = sorted(validator.iter_errors(doc), key=lambda e: list(e.absolute_path))
        if errors:
            where = "/".join(str(p) for p in errors[0].absolute_path)
            print(f"{name}: invalid: at '{where}': {errors[0].message[:200]}")
            all_valid = False
        else:
            print(f"{name}: valid")
    return 0 if all_valid else 1


if __name__ == "__main__":
    sys.exit(main(sys.argv))
