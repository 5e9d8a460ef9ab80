"""Seeded benchmark models written as ModalChain YAML (invented structures; no damping unless stated)."""
import random


def random_network(n, seed):
    """n masses (1-100 kg) on a random spanning tree of springs (10 kN/m - 1 MN/m), n/4 cross springs, a few to ground."""
    rng = random.Random(seed)
    lines = [f"title: random network of {n} masses (seed {seed})", "masses:"]
    for i in range(n):
        lines.append(f"  n{i}: {{mass: {10 ** (2 * rng.random()):.6g} kg}}")
    lines.append("springs:")
    count = 0

    def spring(a, b):
        nonlocal count
        lines.append(f"  k{count}: {{between: [{a}, {b}], stiffness: {10 ** (4 + 2 * rng.random()):.6g} N/m}}")
        count += 1

    for i in range(1, n):
        spring(f"n{rng.randrange(i)}", f"n{i}")
    for _ in range(n // 4):
        a, b = rng.randrange(n), rng.randrange(n)
        if a != b:
            spring(f"n{a}", f"n{b}")
    for _ in range(1 + n // 100):
        spring("ground", f"n{rng.randrange(n)}")
    return "\n".join(lines) + "\n"


def grid(rows, columns):
    """A rows x columns grid of 45 kg masses joined by 12 kN/mm springs, its edge masses held by springs to ground."""
    lines = [f"title: {rows} x {columns} grid", "masses:"]
    for r in range(rows):
        for c in range(columns):
            lines.append(f"  s-{r}-{c}: {{mass: 45 kg}}")
    lines.append("springs:")
    for r in range(rows):
        for c in range(columns):
            if c + 1 < columns:
                lines.append(f"  h-{r}-{c}: {{between: [s-{r}-{c}, s-{r}-{c + 1}], stiffness: 12 kN/mm}}")
            if r + 1 < rows:
                lines.append(f"  v-{r}-{c}: {{between: [s-{r}-{c}, s-{r + 1}-{c}], stiffness: 12 kN/mm}}")
            if r in (0, rows - 1) or c in (0, columns - 1):
                lines.append(f"  g-{r}-{c}: {{between: [ground, s-{r}-{c}], stiffness: 12 kN/mm}}")
    return "\n".join(lines) + "\n"


def harmonic_network(n, points, seed):
    """A random network with 2 % modal damping, a unit force at n0 and a modal sweep of `points` frequencies."""
    text = random_network(n, seed)
    return text + (
        "damping:\n  modal: 2 %\n"
        "loads:\n  push: {kind: force, at: n0, amplitude: 1 kN}\n"
        "harmonic:\n  loads: [push]\n"
        f"  frequencies: {{from: 0.5 Hz, to: 200 Hz, points: {points}, spacing: linear}}\n"
        "  refine: false\n  outputs: [n0, n1, n2]\n  method: modal\n")
