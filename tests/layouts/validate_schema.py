"""Checks the layout JSON Schema: the schema itself, every layout in a folder, and a built-in set
of documents it must accept or reject. Usage: validate_schema.py SCHEMA LAYOUT_DIR

Validates every *.json in LAYOUT_DIR except schema.json and lenses.json (one line per file),
then one built-in valid layout (must be accepted) and built-in invalid ones, each the valid
layout with one mistake (each must be rejected). Exit status 1 on any failure, 2 on bad usage.
Needs jsonschema >= 4 (Debian's python3-jsonschema, so run it with /usr/bin/python3)."""
import copy
import json
import pathlib
import sys

import jsonschema

SKIPPED = {"schema.json", "lenses.json"}

# An invented scenario: a 1064 nm beam folded up by a mirror on a short stage, through a
# 100 mm lens onto a target plane.
VALID = {
    "format": "rendezvous-layout",
    "version": 1,
    "name": "built-in check: one beam, fold mirror, lens, target",
    "beams": [
        {"id": "ir", "wavelength_nm": 1064, "start_mm": [50, 100], "direction_deg": 0,
         "waist_um": 500}
    ],
    "elements": [
        {"id": "fold", "type": "mirror", "at_mm": [200, 100], "aim_at": "L"},
        {"id": "L", "type": "lens", "at_mm": [200, 300], "normal_deg": 90,
         "focal_length_mm": 100},
        {"id": "slide", "type": "stage", "carries": ["fold"], "axis_deg": 0,
         "travel_mm": [-10, 10]},
        {"id": "T", "type": "target", "at_mm": [200, 400], "normal_deg": 90},
    ],
    "target": "T",
}


def element(doc, element_id):
    return next(e for e in doc["elements"] if e["id"] == element_id)


def typo_on_lens(doc):
    element(doc, "L")["focal_lenght_mm"] = 100


def negative_wavelength(doc):
    doc["beams"][0]["wavelength_nm"] = -1064


def m2_below_one(doc):
    doc["beams"][0]["m2"] = 0.5


def mirror_aim_at_and_normal(doc):
    element(doc, "fold")["normal_deg"] = 135


def stage_with_at_mm(doc):
    element(doc, "slide")["at_mm"] = [0, 0]


def missing_format(doc):
    del doc["format"]


def zero_focal_length(doc):
    element(doc, "L")["focal_length_mm"] = 0


def radii_and_focal_length(doc):
    element(doc, "L").update({"glass": "N-BK7", "center_thickness_mm": 4,
                              "front_radius_mm": 51.5})


def linear_without_angle(doc):
    doc["beams"][0]["polarization"] = "linear"


def odd_grid(doc):
    doc["table"] = {"grid_mm": 24}


def three_number_position(doc):
    element(doc, "T")["at_mm"] = [200, 400, 0]


NEGATIVE = [
    ("lens with unknown key focal_lenght_mm", typo_on_lens),
    ("negative wavelength_nm", negative_wavelength),
    ("m2 = 0.5", m2_below_one),
    ("mirror with both aim_at and normal_deg", mirror_aim_at_and_normal),
    ("stage with at_mm", stage_with_at_mm),
    ("missing format", missing_format),
    ("lens with focal_length_mm 0", zero_focal_length),
    ("lens with both radii and focal_length_mm", radii_and_focal_length),
    ("linear polarization without polarization_angle_deg", linear_without_angle),
    ("grid_mm 24", odd_grid),
    ("at_mm with three numbers", three_number_position),
]


def first_error(validator, doc):
    """None if doc is valid, else one line naming where and what."""
    error = jsonschema.exceptions.best_match(validator.iter_errors(doc))
    if error is None:
        return None
    where = "/" + "/".join(str(part) for part in error.absolute_path)
    return f"{where}: {error.message}"


def main(argv):
    if len(argv) != 3:
        print("usage: validate_schema.py SCHEMA LAYOUT_DIR", file=sys.stderr)
        return 2
    schema_path, layout_dir = pathlib.Path(argv[1]), pathlib.Path(argv[2])
    if not layout_dir.is_dir():
        print(f"validate_schema.py: {layout_dir} is not a folder", file=sys.stderr)
        return 2

    try:
        schema = json.loads(schema_path.read_text(encoding="utf-8"))
        jsonschema.Draft202012Validator.check_schema(schema)
    except jsonschema.exceptions.SchemaError as e:
        where = "/" + "/".join(str(part) for part in e.absolute_path)
        print(f"FAIL schema {schema_path}: {where}: {e.message}")
        return 1
    except (OSError, ValueError) as e:
        print(f"FAIL schema {schema_path}: {e}")
        return 1
    validator = jsonschema.Draft202012Validator(schema)
    failures = 0

    layouts = sorted(p for p in layout_dir.glob("*.json") if p.name not in SKIPPED)
    for path in layouts:
        try:
            problem = first_error(validator, json.loads(path.read_text(encoding="utf-8")))
        except (OSError, ValueError) as e:
            problem = f"not readable JSON: {e}"
        print(f"ok   {path.name}" if problem is None else f"FAIL {path.name}: {problem}")
        failures += problem is not None

    problem = first_error(validator, VALID)
    print("ok   built-in valid layout" if problem is None
          else f"FAIL built-in valid layout rejected: {problem}")
    failures += problem is not None

    rejected = 0
    for label, spoil in NEGATIVE:
        doc = copy.deepcopy(VALID)
        spoil(doc)
        problem = first_error(validator, doc)
        if problem is None:
            print(f"FAIL negative case accepted: {label}")
            failures += 1
        else:
            print(f"ok   rejects {label} ({problem})")
            rejected += 1

    print(f"schema: {len(layouts)} layouts valid, {rejected} negative cases rejected"
          if failures == 0 else f"schema: {failures} failures")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
