"""The package's shape: modules stay small and import no cycle (issue 12's acceptance).

Module sizes are counted in lines; imports are read with the standard library's ast
(module level and inside functions alike, ``if TYPE_CHECKING:`` blocks aside), and the
cycles found with Tarjan's strongly connected components (Tarjan, 1972).
"""

from __future__ import annotations

import ast
from pathlib import Path

import beamspread

PACKAGE = Path(beamspread.__file__).parent
LIMIT = 450  # lines


def _modules() -> dict[str, tuple[Path, bool]]:
    out = {}
    for path in PACKAGE.rglob("*.py"):
        parts = list(path.relative_to(PACKAGE.parent).with_suffix("").parts)
        package = parts[-1] == "__init__"
        if package:
            parts = parts[:-1]
        out[".".join(parts)] = (path, package)
    return out


def _imports(name: str, package: bool, node, modules) -> set[str]:
    if isinstance(node, ast.Import):
        targets = [a.name for a in node.names]
    else:
        if node.level:
            base = name.split(".") if package else name.split(".")[:-1]
            base = base[: len(base) - node.level + 1]
            prefix = ".".join(base + ([node.module] if node.module else []))
        else:
            prefix = node.module or ""
        # ``from pkg import name``: the submodule pkg.name if there is one, else pkg itself.
        targets = [
            f"{prefix}.{a.name}" if f"{prefix}.{a.name}" in modules else prefix for a in node.names
        ]
    found = set()
    for target in targets:
        while target and target not in modules:
            target = target.rpartition(".")[0]
        if target and target != name:
            found.add(target)
    return found


def _graph() -> dict[str, set[str]]:
    modules = _modules()
    graph = {}
    for name, (path, package) in modules.items():
        tree = ast.parse(path.read_text(encoding="utf-8"))
        skip = {
            id(n)
            for block in ast.walk(tree)
            if isinstance(block, ast.If) and "TYPE_CHECKING" in ast.unparse(block.test)
            for n in ast.walk(block)
        }
        graph[name] = set()
        for node in ast.walk(tree):
            if isinstance(node, (ast.Import, ast.ImportFrom)) and id(node) not in skip:
                graph[name] |= _imports(name, package, node, modules)
    return graph


def _cycles(graph: dict[str, set[str]]) -> list[list[str]]:
    index, low, stack, on, found = {}, {}, [], set(), []

    def visit(v):
        index[v] = low[v] = len(index)
        stack.append(v)
        on.add(v)
        for w in graph[v]:
            if w not in index:
                visit(w)
                low[v] = min(low[v], low[w])
            elif w in on:
                low[v] = min(low[v], index[w])
        if low[v] == index[v]:
            group = []
            while not group or group[-1] != v:
                group.append(stack.pop())
                on.discard(group[-1])
            if len(group) > 1:
                found.append(sorted(group))

    for v in graph:
        if v not in index:
            visit(v)
    return found


def test_the_cycle_finder_finds_a_cycle():
    assert _cycles({"a": {"b"}, "b": {"c"}, "c": {"a"}, "d": {"a"}}) == [["a", "b", "c"]]
    assert _cycles({"a": {"b"}, "b": set()}) == []


def test_no_module_imports_a_cycle():
    assert _cycles(_graph()) == []


def test_no_module_is_over_the_limit():
    sizes = {
        str(path.relative_to(PACKAGE)): len(path.read_text(encoding="utf-8").splitlines())
        for path, _ in _modules().values()
    }
    assert {name: n for name, n in sizes.items() if n > LIMIT} == {}
