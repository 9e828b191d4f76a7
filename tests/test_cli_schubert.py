"""The command line for Schubert polynomials, pipe dreams and Schubert-to-key expansions."""

from __future__ import annotations

import json

from clirun import ok, refused


def test_schubert_text_and_json() -> None:
    # S_1432 = x1^2x2 + x1^2x3 + x1x2^2 + x1x2x3 + x2^2x3 (Macdonald, Notes on Schubert
    # Polynomials, 1991, table of S_4; from memory, and checked by sympy in test_schubert.py)
    assert ok("schubert", "1432").strip() == "x1^2*x2 + x1^2*x3 + x1*x2^2 + x1*x2*x3 + x2^2*x3"
    doc = json.loads(ok("schubert", "1,4,3,2", "--json"))
    assert doc["nvars"] == 4
    assert len(doc["terms"]) == 5


def test_pipe_dreams_count_is_catalan() -> None:
    # w = 1 n n-1 ... 2 has C_{n-1} pipe dreams (Woo 2004; OEIS A000108): n = 6 gives 42
    assert ok("pipe-dreams", "165432", "--count").strip() == "42"


def test_pipe_dreams_drawing_and_window() -> None:
    out = ok("pipe-dreams", "1432", "-k", "2")
    assert out.splitlines()[0] == "w = (1,4,3,2): 5 pipe dreams"
    assert out.count("pipe dream ") == 2
    assert "... 3 more" in out
    last = ok("pipe-dreams", "1432", "--start", "4", "--style", "unicode")
    assert "pipe dream 4:" in last
    assert "┼" in last


def test_pipe_dreams_json_reads_back_the_schubert_polynomial() -> None:
    # the weights of the pipe dreams sum to S_w (Bergeron-Billey 1993)
    doc = json.loads(ok("pipe-dreams", "2143", "--json", "-k", "0"))
    weights = sorted(tuple(p["weight"]) for p in doc["pipe_dreams"])
    terms = json.loads(ok("schubert", "2143", "--json"))["terms"]
    assert weights == sorted(tuple(e) for e, c in terms for _ in range(c))


def test_schubert_keys_routes_agree() -> None:
    # S_1432 = key(0,2,1,0) (Lascoux-Schutzenberger; from memory, checked in the library tests)
    a = json.loads(ok("schubert-keys", "1432", "--json"))
    b = json.loads(ok("schubert-keys", "1432", "--json", "--method", "polynomial"))
    assert a == b
    assert a["terms"] == [[[0, 2, 1, 0], 1]]


def test_schubert_all_writes_one_line_per_permutation() -> None:
    out = ok("schubert-all", "4", "--keys", "--quiet")
    lines = [json.loads(line) for line in out.splitlines()]
    assert len(lines) == 24  # 4!
    assert lines[0]["permutation"] == [1, 2, 3, 4]
    assert lines[-1]["schubert"]["terms"] == [[[3, 2, 1, 0], 1]]  # S_{w0} = x1^3 x2^2 x3


def test_bad_permutations_are_refused() -> None:
    assert "0-based" in refused("schubert", "0,1,2")
    assert "perm" in refused("pipe-dreams", "1,1,2")


def test_stanley_of_a_product_of_commuting_transpositions() -> None:
    # F_{2143} = F_{s1} F_{s3} = s_1^2 = s_2 + s_11 (Stanley 1984; Pieri)
    doc = json.loads(ok("stanley", "2143", "--json"))
    assert doc["terms"] == [[[2], 1], [[1, 1], 1]]
