#!/usr/bin/env python3
"""The published JSON Schemas agree with the loader.

Usage: schema_test.py SOURCE_DIR SIFTER_BINARY

Checks, with Debian's python3-jsonschema (a general-purpose reference validator, draft 2020-12):
  1. both schemas are valid draft 2020-12 schemas;
  2. every example, every good test project, the benchmark's generated register and every
     shipped library is valid, and sifter computes on each project (exit 0 or 1);
  3. every file of the bad catalogue (tests/data/bad) is refused by sifter (exit 2) and by the
     schema, except the files listed in SEMANTIC with the reason the schema cannot see it;
  4. quantity strings, fractions and votes one by one: the schema accepts exactly what sifter
     accepts, except the cases listed in KNOWN_DIFFERENCES with their reason.
"""
import copy
import json
import pathlib
import subprocess
import sys
import tempfile

try:
    import jsonschema
except ImportError:
    sys.exit("schema_test: python3-jsonschema is missing (sh cmake/install-deps.sh tests installs it)")

# Bad inputs whose badness the schema cannot see: it is in another file, across the document,
# or in the bytes before parsing.
SEMANTIC = {
    "component_twice_in_group": "a component id repeated across channels is a cross-reference",
    "deep_nesting": "nesting depth is a property of the text; \"note\" takes any value",
    "duplicate_component_id": "uniqueness of ids across array items",
    "duplicate_key": "a parsed document already holds one value per key",
    "duplicate_key_escaped": "a parsed document already holds one value per key",
    "duplicate_sif_id": "uniqueness of ids across array items",
    "k_greater_than_n": "K against N inside one string: sifter checks it on the SIF graph",
    "lone_surrogate": "the text's encoding: Python's JSON reader keeps a lone surrogate escape",
    "missing_library": "the file system",
    "severity_not_in_criteria": "a reference into risk_criteria",
    "unknown_component": "a reference into components",
    "unknown_model": "a reference into the libraries",
    "unknown_sif_in_layers": "a reference into sifs",
    "pressure_connection_cycle": "a cycle across the connections",
    "pressure_connection_to_unknown_id": "a reference into sources and equipment",
    "pressure_curve_rising_head": "one curve point against the one before",
    "pressure_density_zero": "the value inside a quantity string (zero is not positive)",
    "pressure_gauge_and_absolute_mixed": "one pressure's basis against another's",
    "pressure_test_below_mawp": "one pressure against another",
    "vote_n_differs": "the vote's N against the number of channels",
    # Plausibility decided in loading (DEVELOPERS.md, "Never silently wrong").
    "applies_to_unknown_category": "a reference into risk_criteria",
    "component_used_twice_series": "a component id repeated across channels is a cross-reference",
    "component_with_only_safe_rates": "which rate keys a component needs, itself or through a model",
    "component_without_rates": "which rate keys a component needs, itself or through a model",
    "duplicate_cause_id": "uniqueness of ids across array items",
    "empty_cause_id": "the schema takes any string as an id",
    "empty_component_id": "the schema takes any string as an id",
    "empty_layer_id": "the schema takes any string as an id",
    "empty_scenario_id": "the schema takes any string as an id",
    "empty_sif_id": "the schema takes any string as an id",
    "empty_subsystem_name": "the schema takes any string as a name",
    "layer_names_empty_sif": "a reference into sifs",
    "library_model_without_rates": "the libraries",
    "partial_stroke_every_seven_minutes": "the partial stroke interval against the proof-test interval and the mission",
    "rate_of_1e30_per_hour": "the magnitude of a rate written as text with its unit",
    "diverse_identical_channels": "the channels' components compared field by field",
    "diverse_same_library_model": "the channels' components compared field by field",
    "perfect_layer": "the schema takes a probability from 0 to 1",
    "pfd_target_on_high_demand": "the target against the demand mode",
    "pfh_target_on_low_demand": "the target against the demand mode",
    "rrf_target_on_high_demand": "the target against the demand mode",
    "sff_disagrees_with_rates": "the declared SFF against the component's rates",
    "test_longer_than_interval": "the test duration against the interval",
    "vendor_pfd_in_high_demand": "the supplier's figure against the demand mode",
    "vendor_pfd_zero": "the schema takes a probability from 0 to 1",
    "vendor_pfh_in_low_demand": "the supplier's figure against the demand mode",
    "zero_cause_frequency": "the schema takes any rate string, 0 included",
    "zero_enabling_probability": "the schema takes a probability from 0 to 1",
    "zero_modifier_probability": "the schema takes a probability from 0 to 1",
    "zero_target_frequency": "the schema takes any rate string, 0 included",
    "zero_tolerable_frequency": "the schema takes any rate string, 0 included",
}

# Inputs on which the schema and sifter differ on purpose, with the reason.
KNOWN_DIFFERENCES = {
    ("rate", "1e400/h"): "the schema does not bound exponents; sifter refuses numbers beyond double range",
    ("rate", "1e-400/h"): "the schema does not bound exponents; sifter refuses numbers below double range",
    ("duration", "1e400 h"): "the schema does not bound exponents",
    ("positive_duration", "1e-400 yr"): "the schema does not bound exponents",
    ("fraction", "1e1%"): "the schema takes percentages written without an exponent",
}

# One slot at a time is filled into a valid project; the rest stays valid.
CASES = {
    "rate": ["2.5e-7/h", "250 FIT", "250FIT", "250 fit", "0.02/yr", "3/mo", "1e-4 /d", "5/ h", " 5/h ", "\t5/h\n",
             "+5/h", "-0/h", "+-0/h", "-0.0e3/h", ".5/h", "5./h", "5e-7/hr", "5/hrs", "5/hour", "5/hours", "5/min",
             "5/s", "5/day", "5/days", "5/wk", "5/week", "5/month", "5/months", "5/years", "5/y", "5/year", "5/a",
             "1e400/h", "1e-400/h",
             "-5/h", "5 Fit", "5/H", "5/fortnight", "5 per h", "nan/h", "inf/h", "5e/h", "0x1/h", "/h", "5", "", "5 /",
             "5/weeks", 2.5e-7, None, True],
    "duration": ["8 h", "8h", " 8 h ", "8 hours", "8 hr", "8 hrs", "8 hour", "0 h", "-0 h", "30 min", "1 s", "3 d",
                 "3 day", "3 days", "2 wk", "2 week", "6 mo", "6 month", "6 months", "2 yr", "2 years", "2 y",
                 "2 year", "2 a", "+1 yr", "1e400 h",
                 "8", "h", "8 H", "8 weeks", "-1 h", "8 h h", "nan h", 8, [], {}],
    "positive_duration": ["20 yr", "0.5 yr", "00.1 yr", "1e-3 yr", "1e-400 yr", "0 h", "0.0 yr", "0e5 yr", "-0 yr",
                          ".0 yr"],
    "fraction": [0, 1, 0.5, -0.0, "5%", "5 %", " 5% ", "0%", "100%", "100.0%", "-0%", "+5%", ".5%", "5.%", "99.99%",
                 "007%", "1e1%", 1.5, -0.1, "100.5%", "-5%", "5", "0.05", "%", "NaN%", "101%", True, None],
    "vote": ["1oo1", "1oo2", "2oo3", "1oo2D", "01oo2", "1oo02", "8oo8", "9oo8", "1oo8", "1oo9", "0oo1", "1oo0",
             "2oo2D", "1oo2d", "1oo2\n", " 1oo2", "1oo2 ", "1oo", "oo2", "1 oo 2", "1o2", 12],
}

BASE = {
    "format": "sifter-project/1",
    "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h", "mission_time": "20 yr"},
    "components": [{"id": "A", "lambda_du": "100 FIT"}, {"id": "B", "lambda_du": "100 FIT"}],
    "sifs": [{"id": "S", "target": {"sil": 1}, "subsystems": [
        {"name": "pair", "role": "sensor", "vote": "1oo2", "channels": ["A", "B"], "beta": "5%"},
        {"name": "vendor", "role": "logic", "pfd_avg": 1e-4, "vote": "1oo1"}]}],
}


def fill(slot, value):
    p = copy.deepcopy(BASE)
    if slot == "rate":
        p["components"][0]["lambda_du"] = value
        p["components"][1]["lambda_du"] = value
    elif slot == "duration":
        p["defaults"]["mttr"] = value
    elif slot == "positive_duration":
        p["defaults"]["mission_time"] = value
    elif slot == "fraction":
        p["sifs"][0]["subsystems"][0]["beta"] = value
    elif slot == "vote":
        p["sifs"][0]["subsystems"][1]["vote"] = value  # a vendor subsystem: the vote is read, not matched to channels
    return p


def sifter_accepts(binary, path):
    r = subprocess.run([binary, "check", "--quiet", str(path)], stdout=subprocess.DEVNULL, stderr=subprocess.PIPE,
                       text=True, timeout=60)
    if r.returncode not in (0, 1, 2):
        raise AssertionError("%s: sifter exited %d: %s" % (path, r.returncode, r.stderr))
    return r.returncode != 2, r.stderr


def parse_strictly(raw):
    """The document as a JSON reader sees it, or None when the bytes are not JSON (BOM, bad UTF-8,
    syntax, NaN literals)."""
    def refuse(name):
        raise ValueError("not JSON: " + name)
    try:
        return json.loads(raw.decode("utf-8"), parse_constant=refuse)
    except (UnicodeDecodeError, ValueError):
        return None


def main():
    source = pathlib.Path(sys.argv[1]).resolve()
    binary = sys.argv[2]
    project_schema = json.loads((source / "data/schema/sifter-project-1.schema.json").read_text())
    library_schema = json.loads((source / "data/schema/sifter-library-1.schema.json").read_text())
    cls = jsonschema.Draft202012Validator
    cls.check_schema(project_schema)
    cls.check_schema(library_schema)
    base_uri = (source / "data/schema/").as_uri() + "/"
    store = {base_uri + "sifter-project-1.schema.json": project_schema,
             base_uri + "sifter-library-1.schema.json": library_schema}
    project = cls(project_schema)
    library = cls(library_schema, resolver=jsonschema.RefResolver(base_uri + "sifter-library-1.schema.json",
                                                                    library_schema, store=store))
    failures = []
    checked = 0

    def expect(condition, message):
        nonlocal checked
        checked += 1
        if not condition:
            failures.append(message)

    # 2. Good files.
    good = sorted((source / "examples").glob("*.json")) + sorted((source / "tests/data/good").glob("*.json"))
    expect(len(good) >= 4, "at least the examples and one good test project")
    for path in good:
        errors = list(project.iter_errors(json.loads(path.read_text())))
        expect(not errors, "%s: schema refuses a good project: %s" % (path, [e.message for e in errors[:3]]))
        accepted, err = sifter_accepts(binary, path)
        expect(accepted, "%s: sifter refuses a good project: %s" % (path, err))
    for path in sorted((source / "data/components").glob("*.json")):
        errors = list(library.iter_errors(json.loads(path.read_text())))
        expect(not errors, "%s: schema refuses a shipped library: %s" % (path, [e.message for e in errors[:3]]))

    # The synthetic register of the benchmark (tests/bench/make_register.py) is a valid project too.
    with tempfile.TemporaryDirectory() as tmp:
        register = pathlib.Path(tmp) / "register.json"
        subprocess.run([sys.executable, str(source / "tests/bench/make_register.py"), "40", str(register),
                        "--library", str(source / "data/components/illustrative.json")], check=True)
        errors = list(project.iter_errors(json.loads(register.read_text())))
        expect(not errors, "the generated register: schema refuses it: %s" % [e.message for e in errors[:3]])
        accepted, err = sifter_accepts(binary, register)
        expect(accepted, "the generated register: sifter refuses it: %s" % err)

    # 3. The bad catalogue.
    bad = sorted((source / "tests/data/bad").glob("*.json"))
    expect(len(bad) >= 40, "the bad catalogue holds at least 40 files")
    for path in bad:
        accepted, _ = sifter_accepts(binary, path)
        expect(not accepted, "%s: sifter accepts a file of the bad catalogue" % path)
        doc = parse_strictly(path.read_bytes())
        schema_refuses = doc is None or not project.is_valid(doc)
        if path.stem in SEMANTIC:
            expect(not schema_refuses, "%s is listed as semantic (%s) but the schema refuses it: take it off the list"
                   % (path.stem, SEMANTIC[path.stem]))
        else:
            expect(schema_refuses, "%s: the schema accepts a bad file that sifter refuses" % path.stem)
    for name in SEMANTIC:
        expect((source / "tests/data/bad" / (name + ".json")).exists(), "SEMANTIC names a missing file: " + name)

    # 4. Values one by one, through both.
    with tempfile.TemporaryDirectory() as tmp:
        for slot, values in CASES.items():
            for i, value in enumerate(values):
                doc = fill(slot, value)
                path = pathlib.Path(tmp) / ("%s_%d.json" % (slot, i))
                path.write_text(json.dumps(doc))
                by_sifter, err = sifter_accepts(binary, path)
                by_schema = project.is_valid(doc)
                key = (slot, value) if isinstance(value, str) else None
                if key in KNOWN_DIFFERENCES:
                    expect(by_sifter != by_schema, "%s %r: listed as a known difference (%s) but both agree"
                           % (slot, value, KNOWN_DIFFERENCES[key]))
                else:
                    expect(by_sifter == by_schema, "%s %r: sifter %s, schema %s%s" % (
                        slot, value, "accepts" if by_sifter else "refuses", "accepts" if by_schema else "refuses",
                        ("\n" + err) if err else ""))

    for f in failures:
        print("FAIL:", f)
    print("schema_test: %d checks, %d failed" % (checked, len(failures)))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
