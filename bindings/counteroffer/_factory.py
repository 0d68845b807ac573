"""The function factory: one Python function per row of the library's table.

The function has the row's name, its arguments in order with their defaults (a real
signature, so ``help``, ``inspect`` and IDEs show it) and ``out=`` keyword-only; its
body hands the values to ``_evaluate.evaluate``.  The docstring comes from ``_docs``.
"""

from __future__ import annotations

import os
from typing import Any, Callable, Dict, Tuple

from . import _core
from ._evaluate import PACKAGE_DIR, evaluate
from ._results import result_class
from ._spec import FunctionSpec


def signature_source(spec: FunctionSpec) -> Tuple[str, Dict[str, Any]]:
    """The def statement of the function, and the defaults it refers to."""
    params = []
    defaults: Dict[str, Any] = {}
    for arg in spec.args:
        if arg.has_default:
            defaults[f"_d_{arg.name}"] = spec.default(arg)
            params.append(f"{arg.name}=_d_{arg.name}")
        else:
            params.append(arg.name)
    names = ", ".join(a.name for a in spec.args)
    src = (f"def {spec.name}({', '.join(params)}, *, out=None):\n"
           f"    return _evaluate(({names},), out)\n")
    return src, defaults


def make_function(spec: FunctionSpec, doc: str) -> Callable[..., Any]:
    result_cls = result_class(spec)
    fn: Callable[..., Any]

    def call(values: Tuple[Any, ...], out: Any) -> Any:
        return evaluate(spec, fn, values, out, result_cls)

    src, namespace = signature_source(spec)
    namespace["_evaluate"] = call
    # compiled under a name inside the package, so that warnings skip this frame too
    code = compile(src, os.path.join(PACKAGE_DIR, f"<{spec.name}>"), "exec")
    exec(code, namespace)  # noqa: S102 - a signature built from the library's table
    fn = namespace[spec.name]
    fn.__module__ = "counteroffer"
    fn.__qualname__ = spec.name
    fn.__doc__ = doc
    fn.spec = spec  # type: ignore[attr-defined]
    fn.ufunc = _core.ufuncs[spec.name]  # type: ignore[attr-defined]
    fn.status_ufunc = _core.status_ufuncs[spec.name]  # type: ignore[attr-defined]
    if result_cls is not None:
        fn.Result = result_cls  # type: ignore[attr-defined]
    return fn
