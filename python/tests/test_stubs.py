"""The type stubs say what the package has: every public name, every signature."""

import ast
import inspect
from pathlib import Path

import ringheat

STUB = Path(ringheat.__file__).with_name("__init__.pyi")
ON_ENGINE = ("estimate", "estimate_many", "estimate_file", "strain", "cbh")


def params(node):
    a = node.args
    return [p.arg for p in [*a.posonlyargs, *a.args, *a.kwonlyargs] if p.arg != "self"]


def stub_tree():
    return ast.parse(STUB.read_text(encoding="utf-8"))


def test_the_stub_ships_with_the_package():
    assert STUB.is_file() and STUB.with_name("py.typed").is_file()
    assert STUB.with_name("_ringheat.pyi").is_file()


def test_the_stub_names_every_public_name():
    names = set()
    for node in stub_tree().body:
        if isinstance(node, (ast.FunctionDef, ast.ClassDef)):
            names.add(node.name)
        elif isinstance(node, ast.AnnAssign):
            names.add(node.target.id)
        elif isinstance(node, ast.Assign):
            names.update(t.id for t in node.targets)
        elif isinstance(node, ast.ImportFrom) and node.module == "_types":
            names.update(a.asname for a in node.names if a.asname)
    assert set(ringheat.__all__) <= names


def test_stub_signatures_are_the_runtime_ones():
    for node in stub_tree().body:
        if isinstance(node, ast.FunctionDef):
            if node.name in ON_ENGINE:
                method = getattr(ringheat.Engine, node.name)
                expected = [p for p in inspect.signature(method).parameters if p != "self"]
                expected += ["tables", "extra_tables"]
            else:
                expected = list(inspect.signature(getattr(ringheat, node.name)).parameters)
            assert params(node) == expected, node.name
        elif isinstance(node, ast.ClassDef) and node.name in ("Engine", "Rows"):
            for item in node.body:
                if isinstance(item, ast.FunctionDef) and not any(
                    isinstance(d, ast.Name) and d.id == "property" for d in item.decorator_list
                ):
                    runtime = getattr(getattr(ringheat, node.name), item.name)
                    expected = [p for p in inspect.signature(runtime).parameters if p != "self"]
                    assert params(item) == expected, f"{node.name}.{item.name}"
