"""Exact nullspaces with sympy, timed, for tests/bench/compare-sympy.ts.

Reads a JSON file of composition matrices (one per equation, entries as decimal strings, written
by compare-sympy.ts from our parser) and, for each, computes a basis of the integer nullspace:
sympy's Matrix.nullspace() (exact rationals), each vector scaled to primitive whole numbers.
sympy gets the matrices ready-made: it does no parsing and builds no reply, so its figures are
a lower bound on what a sympy-based balancer would cost.

Driven by compare-sympy.ts over stdin/stdout, one command per line: "matrix" times one round of
Matrix.nullspace over the whole set, "domain" one round of DomainMatrix over QQ (sympy's faster
internal layer, for reference), "bases" returns the bases found, for the cross-check.

Run by: npm run bench:sympy (which starts /usr/bin/python3 tests/bench/sympy-nullspace.py matrices.json)
(Debian's python3-sympy: apt-get install -y python3-sympy.)
"""

import json
import sys
import time
from functools import reduce
from math import gcd

import sympy
from sympy import Matrix
from sympy.polys.domains import QQ
from sympy.polys.matrices import DomainMatrix


def primitive(values):
    """Whole numbers with gcd 1 and the first non-zero entry positive, from exact rationals."""
    dens = [int(sympy.fraction(v)[1]) for v in values]
    lcm = reduce(lambda a, b: a * b // gcd(a, b), dens, 1)
    ints = [int(v * lcm) for v in values]
    g = reduce(gcd, (abs(x) for x in ints), 0) or 1
    first = next((x for x in ints if x != 0), 1)
    sign = -1 if first < 0 else 1
    return [sign * x // g for x in ints]


def with_matrix(rows, cols):
    if not rows:
        return [[1 if i == j else 0 for i in range(cols)] for j in range(cols)]
    return [primitive(list(v)) for v in Matrix(rows).nullspace()]


def with_domain_matrix(rows, cols):
    if not rows:
        return [[1 if i == j else 0 for i in range(cols)] for j in range(cols)]
    dm = DomainMatrix([[QQ(x) for x in row] for row in rows], (len(rows), cols), QQ)
    basis = dm.nullspace().to_Matrix()
    return [primitive(list(basis.row(i))) for i in range(basis.rows)]


def one_round(method, problems):
    start = time.perf_counter()
    results = [method(rows, cols) for rows, cols in problems]
    return time.perf_counter() - start, results


def main():
    data = json.load(open(sys.argv[1], encoding="utf-8"))
    problems = [([[int(x) for x in row] for row in m["rows"]], m["cols"]) for m in data]
    one_round(with_matrix, problems[:20])  # warm-up
    print(json.dumps({"sympy": sympy.__version__, "python": sys.version.split()[0]}), flush=True)
    # One command per line on stdin, one JSON answer per line on stdout, so that the caller can
    # alternate its own rounds with sympy's under the same machine load.
    for command in sys.stdin:
        command = command.strip()
        if command == "matrix":
            seconds, _ = one_round(with_matrix, problems)
            print(json.dumps({"seconds": seconds}), flush=True)
        elif command == "domain":
            seconds, _ = one_round(with_domain_matrix, problems)
            print(json.dumps({"seconds": seconds}), flush=True)
        elif command == "bases":
            _, bases = one_round(with_matrix, problems)
            print(json.dumps([[[str(x) for x in v] for v in b] for b in bases]), flush=True)
        else:
            break


if __name__ == "__main__":
    main()
