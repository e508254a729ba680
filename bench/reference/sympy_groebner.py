"""Reference run for `npm run bench`: the reduced Groebner basis of a bench system with SymPy.

Usage: /usr/bin/python3 bench/reference/sympy_groebner.py FILE [--field P]
Reads the CLI input format (`# comment`, `vars: x, y`, `order: grevlex`, one polynomial per
line) and prints the basis in the CLI's canonical syntax: one monic polynomial per line, terms
in decreasing order, `*` between factors, `^` for powers, fractions a/b, lines sorted by
increasing leading monomial. Exit code 3 for an order SymPy's `groebner` cannot take (block orders).
Written for Debian's python3-sympy 1.11.
"""
import sys

from sympy import GF, QQ, Poly, Symbol, groebner
from sympy.parsing.sympy_parser import parse_expr
from sympy.polys.orderings import monomial_key


def read_system(path):
    variables, order, polys = None, None, []
    with open(path, encoding="utf-8") as handle:
        for raw in handle:
            line = raw.strip()
            if not line or line.startswith("#"):
                continue
            if line.startswith("vars:"):
                variables = [v.strip() for v in line[len("vars:"):].split(",")]
            elif line.startswith("order:"):
                order = line[len("order:"):].strip()
            else:
                polys.append(line)
    return variables, order, polys


def coefficient_text(c, modulus):
    if modulus is not None:
        return str(int(c) % modulus)
    c = QQ.to_sympy(c)
    return str(c.p) if c.q == 1 else "%d/%d" % (c.p, c.q)


def canonical(poly, names, order, modulus):
    # Terms come from Poly.terms(order=...) in decreasing order; the leading one is 1 (monic).
    parts = []
    for index, (exps, coef) in enumerate(poly.terms(order=order)):
        text = coefficient_text(coef, modulus)
        negative = text.startswith("-")
        if negative:
            text = text[1:]
        factors = [n if e == 1 else "%s^%d" % (n, e) for n, e in zip(names, exps) if e > 0]
        mono = "*".join(factors)
        body = text if not mono else (mono if text == "1" else text + "*" + mono)
        if index == 0:
            parts.append("-" + body if negative else body)
        else:
            parts.append((" - " if negative else " + ") + body)
    return "".join(parts) or "0"


def to_integers_mod(expr, symbols, modulus):
    # GF(p) refuses fractions such as 5/2: map a/b to a * b^-1 mod p before SymPy sees it.
    poly = Poly(expr, *symbols, domain=QQ)
    terms = {}
    for exps, coef in poly.terms():
        c = QQ.to_sympy(coef)
        terms[exps] = c.p * pow(c.q, -1, modulus) % modulus
    return Poly.from_dict(terms, *symbols, domain=QQ).as_expr()


def make_monic(poly, order):
    # Poly.monic() divides by the lex-leading coefficient; we need the one of the chosen order.
    return poly.quo_ground(poly.terms(order=order)[0][1])


def main(argv):
    path = argv[1]
    modulus = int(argv[argv.index("--field") + 1]) if "--field" in argv else None
    names, order, lines = read_system(path)
    if order not in ("lex", "grlex", "grevlex"):
        print("SymPy's groebner takes only lex, grlex, grevlex; got %r" % order, file=sys.stderr)
        return 3
    symbols = [Symbol(n) for n in names]
    # A local dictionary keeps names such as E or S from meaning SymPy's constants.
    local = {n: s for n, s in zip(names, symbols)}
    exprs = [parse_expr(line.replace("^", "**"), local_dict=local) for line in lines]
    if modulus is not None:
        exprs = [to_integers_mod(e, symbols, modulus) for e in exprs]
    domain = GF(modulus) if modulus is not None else QQ
    basis = groebner(exprs, *symbols, order=order, domain=domain)
    key = monomial_key(order)
    polys = [make_monic(Poly(g, *symbols, domain=domain), order) for g in basis.exprs]
    polys.sort(key=lambda p: key(p.terms(order=order)[0][0]))
    for p in polys:
        print(canonical(p, names, order, modulus))
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
