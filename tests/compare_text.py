#!/usr/bin/env python3
"""Compares a text, Markdown or CSV output of cairn with an expected file.

    python3 tests/compare_text.py EXPECTED ACTUAL

Exit 0 when they agree, else 1 with the first difference on stdout (file line and both lines).

The outputs print rounded numbers, and the same program built by another compiler may round
the last printed digit the other way (the JSON comparison allows 1e-9 relative for the same
reason). So each line is cut into words at white space, and each word into numbers and the
text between them:
  - the text must be the same;
  - decimal numbers must agree within one unit in their last printed place (-0.0 equals
    0.0); whole numbers (counts, the digits of an id such as R01) must be the same;
  - runs of '-' or '=' (table rules) match any other run, since a column one digit wider
    draws a longer rule;
  - lines naming the command line or its options (they name paths and flags) are skipped.
Both files must have the same number of lines, apart from the skipped ones.
"""
import re
import sys

NUMBER = re.compile(r"[-+]?(?:\d+\.\d+|\d+)(?:[eE][-+]?\d+)?")
RULE = re.compile(r"^[-=:|]{2,}$")
# Lines that name the command line: text 'command: ...', Markdown '- command: `...`',
# CSV '# cairn 0.1.0, input cap.yaml, options: ...'.
SKIP = re.compile(r"^(?:- )?command: |^# cairn .*, options: ")


def pieces(word):
    """The word as a list of ('text', s) and ('number', s) pieces."""
    out, at = [], 0
    for m in NUMBER.finditer(word):
        if m.start() > at:
            out.append(("text", word[at:m.start()]))
        out.append(("number", m.group()))
        at = m.end()
    if at < len(word):
        out.append(("text", word[at:]))
    return out


def last_place(number):
    """One unit in the last printed decimal place of a number as printed."""
    mantissa, _, exponent = number.lower().partition("e")
    decimals = len(mantissa.split(".")[1]) if "." in mantissa else 0
    return 10.0 ** (int(exponent or 0) - decimals)


def same_number(a, b):
    # Whole numbers (counts, ids such as R01, stiffnesses printed without decimals) must be
    # the same; only decimals are rounded at their last place.
    if "." not in a or "." not in b:
        return a == b
    tolerance = max(last_place(a), last_place(b)) * (1.0 + 1e-9)
    return abs(float(a) - float(b)) <= tolerance


def same_word(a, b):
    if a == b or (RULE.match(a) and RULE.match(b)):
        return True
    pa, pb = pieces(a), pieces(b)
    if len(pa) != len(pb):
        return False
    for (kind_a, x), (kind_b, y) in zip(pa, pb):
        if kind_a != kind_b:
            return False
        if kind_a == "text" and x != y:
            return False
        if kind_a == "number" and not same_number(x, y):
            return False
    return True


def kept(path):
    with open(path, encoding="utf-8") as f:
        return [(i + 1, line.rstrip("\n")) for i, line in enumerate(f) if not SKIP.search(line)]


def compare(expected_path, actual_path):
    expected, actual = kept(expected_path), kept(actual_path)
    for (line_e, e), (line_a, a) in zip(expected, actual):
        we, wa = e.split(), a.split()
        if len(we) != len(wa) or not all(same_word(x, y) for x, y in zip(we, wa)):
            return f"line {line_e}: expected '{e.strip()}', got '{a.strip()}' (line {line_a})"
    if len(expected) != len(actual):
        return f"{len(expected)} lines expected, got {len(actual)}"
    return None


if __name__ == "__main__":
    if len(sys.argv) != 3:
        sys.exit("usage: compare_text.py EXPECTED ACTUAL")
    difference = compare(sys.argv[1], sys.argv[2])
    if difference:
        print(difference)
        sys.exit(1)
