"""The examples in the docstrings run and print what they show (on the installed package)."""

from __future__ import annotations

import doctest
import importlib
import pkgutil

import pytest

import beamspread

_FLAGS = doctest.ELLIPSIS | doctest.NORMALIZE_WHITESPACE


def _examples():
    """Every docstring with examples, outside the command line (its examples are shell lines)."""
    finder = doctest.DocTestFinder()
    for info in pkgutil.walk_packages(beamspread.__path__, "beamspread."):
        if ".cli" in info.name or info.name.endswith("__main__"):
            continue
        module = importlib.import_module(info.name)
        for test in finder.find(module):
            if test.examples and test.name.startswith(info.name):
                yield pytest.param(test, id=test.name)


@pytest.mark.parametrize("test", list(_examples()))
def test_docstring_example(test):
    runner = doctest.DocTestRunner(optionflags=_FLAGS)
    runner.run(test)
    assert runner.failures == 0, f"{runner.failures} of {len(test.examples)} lines failed"
