#!/usr/bin/env python3
"""Reference values of the adversary bounds by an independent solver, for AdversaryReferenceTest.

Writes core/src/test/resources/spanwright/bounds/adversary-cvxopt.json. Run by hand (CI does not
run it; the JSON it wrote is committed):

    apt-get install python3-cvxopt      # Debian bookworm: CVXOPT 1.3.0
    /usr/bin/python3 core/src/test/python/adversary_cvxopt.py

Solver: CVXOPT's cone solver (cvxopt.solvers.sdp), an interior-point method written independently
of Spanwright's, with tolerances abstol = reltol = feastol = 1e-9 (1e-8, then 1e-7 where it stalls
short of 'optimal'; the row says which).

The SDP (common practice, no source; the max form of the general adversary bound with a
distribution on the inputs): over symmetric Γ supported on pairs x, y with f(x) ≠ f(y) and a
diagonal Δ = diag(δ) with Σ δ_x = 1,

    ADV±(f) = max Σ_{x,y} Γ[x,y]   subject to   Δ − Γ∘D_i ⪰ 0 for every variable i,

where (Γ∘D_i)[x,y] = Γ[x,y] if x_i ≠ y_i and 0 otherwise. ADV(f) is the same with Γ ≥ 0. The
functions are given by their domain and values, input strings x1…xn left to right, so nothing
depends on a bit order. Random functions use Python's random.Random with the seed named in the row.
"""
import json
import os
import random
import sys
import time

import cvxopt
from cvxopt import matrix, spmatrix, solvers

TOLERANCES = (1e-9, 1e-8, 1e-7)


def adversary(inputs, values, n, positive, tol):
    """(value, gap, status, iterations, seconds) of ADV± (positive=False) or ADV (positive=True)."""
    N = len(inputs)
    pairs = [(a, b) for a in range(N) for b in range(N)
             if a < b and values[a] != values[b]]
    m = len(pairs)
    nv = m + N  # gamma_p, then delta_x
    c = matrix([-2.0] * m + [0.0] * N)
    Gs, hs = [], []
    for i in range(n):
        rows, cols, vals = [], [], []
        for p, (a, b) in enumerate(pairs):
            if inputs[a][i] != inputs[b][i]:
                # + (E_ab + E_ba): s = h - G x = Δ - Γ∘D_i (only the lower triangle is read)
                lo, hi = max(a, b), min(a, b)
                rows.append(lo + hi * N); cols.append(p); vals.append(1.0)
                rows.append(hi + lo * N); cols.append(p); vals.append(1.0)
        for x in range(N):
            rows.append(x + x * N); cols.append(m + x); vals.append(-1.0)
        Gs.append(spmatrix(vals, rows, cols, (N * N, nv)))
        hs.append(matrix(0.0, (N, N)))
    A = spmatrix([1.0] * N, [0] * N, list(range(m, nv)), (1, nv))
    b = matrix(1.0)
    kw = {}
    if positive:
        kw['Gl'] = spmatrix([-1.0] * m, list(range(m)), list(range(m)), (m, nv))
        kw['hl'] = matrix(0.0, (m, 1))
    solvers.options.update({'abstol': tol, 'reltol': tol, 'feastol': tol,
                            'maxiters': 60, 'show_progress': False})
    t0 = time.process_time()
    sol = solvers.sdp(c, Gs=Gs, hs=hs, A=A, b=b, **kw)
    secs = time.process_time() - t0
    primal = -sol['primal objective']
    dual = -sol['dual objective']
    return (0.5 * (primal + dual), abs(primal - dual), sol['status'], sol['iterations'], secs)


def cube(n):
    return [format(k, '0%db' % n) for k in range(1 << n)]


def from_expr(n, fn):
    ins = cube(n)
    return ins, [1 if fn([int(ch) for ch in s]) else 0 for s in ins]


def random_function(n, seed, promise):
    r = random.Random(seed)
    ins = [s for s in cube(n) if not promise or r.random() < 0.7]
    vals = [r.randrange(2) for _ in ins]
    if len(set(vals)) < 2:
        vals[0] = 1 - vals[-1]
    return ins, vals


def cases():
    yield 'or-2', 2, *from_expr(2, lambda x: x[0] or x[1])
    yield 'majority-3', 3, *from_expr(3, lambda x: sum(x) >= 2)
    yield 'parity-4', 4, *from_expr(4, lambda x: sum(x) % 2 == 1)
    # 1 on the monotone strings: 0000, 0001, 0011, 0111, 1111, 1110, 1100, 1000
    mono = {'0000', '0001', '0011', '0111', '1111', '1110', '1100', '1000'}
    ins = cube(4)
    yield 'sorted-4', 4, ins, [1 if s in mono else 0 for s in ins]
    yield 'x1&(x2|x3)|x4&x5', 5, *from_expr(5, lambda x: (x[0] and (x[1] or x[2])) or (x[3] and x[4]))
    yield 'exactly-two-of-5', 5, *from_expr(5, lambda x: sum(x) == 2)
    for n, seed, promise in [(4, 11, False), (5, 12, False), (5, 13, True),
                             (6, 14, False), (6, 15, True)]:
        name = 'random-%d-seed%d%s' % (n, seed, '-promise' if promise else '')
        yield name, n, *random_function(n, seed, promise)
    if os.environ.get('SEVEN'):
        yield 'random-7-seed16', 7, *random_function(7, 16, False)


def main():
    out = sys.argv[1] if len(sys.argv) > 1 else os.path.join(
        os.path.dirname(__file__), '..', 'resources', 'spanwright', 'bounds', 'adversary-cvxopt.json')
    rows = []
    for name, n, ins, vals in cases():
        row = {'name': name, 'n': n, 'values': ''.join(str(v) for v in vals)}
        if len(ins) < (1 << n):
            row['inputs'] = ins
        for key, positive in (('advPm', False), ('adv', True)):
            for tol in TOLERANCES:
                v, gap, status, its, secs = adversary(ins, vals, n, positive, tol)
                if status == 'optimal':
                    break
            print('%-28s %-5s %.12f gap %.1e %s tol %g %d its %.1f s' % (name, key, v, gap, status, tol, its, secs),
                  file=sys.stderr)
            row[key] = round(v, 12)
            row[key + 'Gap'] = float('%.2e' % gap)
            row[key + 'Status'] = status
            row[key + 'Tolerance'] = tol
        rows.append(row)
    doc = {
        'about': 'Adversary bounds by CVXOPT %s (cvxopt.solvers.sdp), abstol = reltol = feastol = *Tolerance; '
                 'written by core/src/test/python/adversary_cvxopt.py. advPm = ADV±, adv = ADV (Γ ≥ 0); '
                 'each is the midpoint of the solver\'s primal and dual objectives, *Gap their difference. '
                 'Inputs are x1…xn left to right; a row without "inputs" is the whole cube in counting order.'
                 % cvxopt.__version__,
        'functions': rows,
    }
    tmp = out + '.tmp'
    with open(tmp, 'w', encoding='utf-8') as fh:
        json.dump(doc, fh, indent=1, ensure_ascii=False)
        fh.write('\n')
    os.replace(tmp, out)


if __name__ == '__main__':
    main()
