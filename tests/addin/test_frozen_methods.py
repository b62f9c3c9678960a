#!/usr/bin/python3
"""Saved workbooks keep working: the generated add-in IDL still has every frozen method.

Documents store add-in calls as ORG.RXNHEAT.CALC.FUNCTIONS.<method>(...) with the arguments by
position, so each method of addin/idl/frozen-methods.txt must stay in the generated IDL with the
same name, the same arguments in the same order, and the frozen methods in their frozen order
(new methods may come between them). No office needed. Exit status 0 when all hold.

usage: test_frozen_methods.py FROZEN.txt GENERATED.idl
"""
import re
import sys


def frozen_methods(path):
    out = []
    with open(path, encoding="utf-8") as f:
        for n, line in enumerate(f, 1):
            words = line.split("#", 1)[0].split()
            if not words:
                continue
            name, count, args = words[0], int(words[1]), words[2:]
            if count != len(args):
                raise SystemExit("%s:%d: %s says %d arguments but lists %d" %
                                 (path, n, name, count, len(args)))
            out.append((name, args))
    return out


def idl_methods(path):
    """(name, [argument names]) of each method of the IDL's interface, in order."""
    with open(path, encoding="utf-8") as f:
        text = re.sub(r"//[^\n]*", "", f.read())
    body = re.search(r"interface\s+XRxnheatFunctions\s*:[^{]*\{(.*?)\};", text, re.S)
    if not body:
        raise SystemExit("%s: no interface XRxnheatFunctions" % path)
    out = []
    for m in re.finditer(r"(\w+)\s*\(([^)]*)\)", body.group(1)):
        name, params = m.group(1), m.group(2).strip()
        if name == "raises":
            continue
        args = [p.split()[-1] for p in params.split(",")] if params else []
        out.append((name, args))
    return out


def main():
    frozen = frozen_methods(sys.argv[1])
    generated = idl_methods(sys.argv[2])
    index = {name: i for i, (name, _) in enumerate(generated)}
    failures = 0
    last = -1
    for name, args in frozen:
        if name not in index:
            print("FAIL  %s: missing from the generated IDL (saved workbooks call it)" % name)
            failures += 1
            continue
        got = generated[index[name]][1]
        # A method may gain optional arguments at its end: a saved call passes fewer, and Calc
        # hands the missing trailing ones over as empty (omitted). Nothing before them may change.
        if got[:len(args)] != args:
            print("FAIL  %s: arguments %s, frozen %s" % (name, got, args))
            failures += 1
        if index[name] < last:
            print("FAIL  %s: comes before a method that is frozen ahead of it" % name)
            failures += 1
        last = max(last, index[name])
    print("%d frozen methods checked against %d generated, %d failed" %
          (len(frozen), len(generated), failures))
    return 1 if failures or not frozen else 0


if __name__ == "__main__":
    sys.exit(main())
