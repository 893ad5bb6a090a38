#!/usr/bin/env python3
"""`sifter init` writes what `check` and the published schemas accept, and what the README shows.

Usage: init_test.py SOURCE_DIR SIFTER_BINARY

  1. `init --example` and plain `init` write a project and its library that `check` accepts as
     they are (exit 0: the example's SIF meets its target);
  2. both files, with their comments removed, are valid against data/schema/ (and so are the
     templates-and-catalogue test projects);
  3. the README's worked example is `init --example`'s project and library, byte for byte;
  4. init never replaces a file that exists (exit 2).
"""
import json
import pathlib
import subprocess
import sys
import tempfile

import jsonschema


def without_comments(text):
    """// and /* */ comments blanked as sifter does; a comment inside a string is text."""
    out, i, n = [], 0, len(text)
    while i < n:
        c = text[i]
        if c == '"':
            j = i + 1
            while j < n and text[j] != '"':
                j += 2 if text[j] == "\\" else 1
            out.append(text[i:j + 1])
            i = j + 1
        elif text.startswith("//", i):
            j = text.find("\n", i)
            j = n if j < 0 else j
            out.append(" " * (j - i))
            i = j
        elif text.startswith("/*", i):
            j = text.index("*/", i + 2) + 2
            out.append("".join(ch if ch == "\n" else " " for ch in text[i:j]))
            i = j
        else:
            out.append(c)
            i += 1
    return "".join(out)


def readme_block(readme, marker):
    """The fenced block that follows the line holding `marker`."""
    at = readme.index(marker)
    start = readme.index("```", at)
    start = readme.index("\n", start) + 1
    end = readme.index("```", start)
    return readme[start:end]


def main():
    source, sifter = pathlib.Path(sys.argv[1]), sys.argv[2]
    source = source.resolve()
    project_doc = json.loads((source / "data/schema/sifter-project-1.schema.json").read_text())
    library_doc = json.loads((source / "data/schema/sifter-library-1.schema.json").read_text())
    base_uri = (source / "data/schema/").as_uri() + "/"  # the library schema refers to the project's
    store = {base_uri + "sifter-project-1.schema.json": project_doc,
             base_uri + "sifter-library-1.schema.json": library_doc}
    project_schema = jsonschema.Draft202012Validator(project_doc)
    library_schema = jsonschema.Draft202012Validator(
        library_doc, resolver=jsonschema.RefResolver(base_uri + "sifter-library-1.schema.json", library_doc, store=store))
    failures = []

    def expect(ok, what):
        if not ok:
            failures.append(what)

    def valid(schema, path):
        errors = list(schema.iter_errors(json.loads(without_comments(path.read_text()))))
        expect(not errors, "%s: the schema refuses it: %s" % (path.name, [e.message for e in errors[:3]]))

    with tempfile.TemporaryDirectory() as tmp:
        for args, name in ((["--example"], "unit10.json"), ([], "mine.json")):
            project = pathlib.Path(tmp) / name
            run = subprocess.run([sifter, "init", str(project)] + args, capture_output=True, text=True)
            expect(run.returncode == 0, "init %s: exit %d %s" % (name, run.returncode, run.stderr))
            library = project.with_name(project.stem + "-library.json")
            check = subprocess.run([sifter, "check", str(project)], capture_output=True, text=True)
            expect(check.returncode == 0, "check %s: exit %d\n%s" % (name, check.returncode, check.stderr))
            valid(project_schema, project)
            valid(library_schema, library)
        again = subprocess.run([sifter, "init", str(pathlib.Path(tmp) / "unit10.json")], capture_output=True, text=True)
        expect(again.returncode == 2, "init over an existing file: exit %d" % again.returncode)
        readme = (source / "README.md").read_text()
        example = pathlib.Path(tmp) / "unit10.json"
        expect(readme_block(readme, "<!-- init-example: unit10.json -->") == example.read_text(),
               "README's unit10.json differs from `sifter init --example`")
        expect(readme_block(readme, "<!-- init-example: unit10-library.json -->") ==
               example.with_name("unit10-library.json").read_text(),
               "README's unit10-library.json differs from `sifter init --example`")
    for path in sorted((source / "tests/data/reuse").glob("*.json")):
        valid(project_schema, path)
    for f in failures:
        print("FAIL:", f)
    print("init_test: %d failures" % len(failures))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
