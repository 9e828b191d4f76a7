"""Every Examples section of the public modules runs and prints what it says."""

from __future__ import annotations

import doctest
import importlib

import pytest

MODULES = [
    "druse.axioms",
    "druse.crystal",
    "druse.demazure",
    "druse.expansion",
    "druse.io",
    "druse.key",
    "druse.pipe_dreams",
    "druse._pipe_cells",
    "druse.pipe_crystal",
    "druse.poly",
    "druse.recognition",
    "druse.schubert",
    "druse.schubert_keys",
    "druse.schur",
    "druse.structure",
    "druse.tableau_keys",
    "druse.tableaux",
    "druse.user_crystal",
]


@pytest.mark.parametrize("name", MODULES)
def test_examples_run(name: str) -> None:
    module = importlib.import_module(name)
    failed, attempted = doctest.testmod(module, optionflags=doctest.ELLIPSIS)
    assert failed == 0
    assert attempted > 0, f"{name} has no examples"
