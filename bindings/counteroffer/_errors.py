"""Error policy of the Python package: warning and error classes, ``errstate``.

The library reports a status for every element (names from ``cto_status_name``):
``invalid``, ``no_deal``, ``indeterminate``, ``no_convergence``, ``internal``, ``precision`` (share_range: the
estimates are reported, but some quantile is short of the digit target); and one
category of the package's own, ``implausible``: a valid value outside the plausible
range the library gives its argument (a rate typed as 8 for 8%).
The wrappers gather the statuses of one call and apply this policy once, after the
loop.  Each category takes one action:

``"raise"``
    raise the category's error class (a subclass of :class:`CounterofferError`);
``"warn"``
    issue the category's warning class (a subclass of :class:`CounterofferWarning`)
    and return the library's output (NaN, or the no-deal payoff for ``no_deal``);
``"ignore"``
    return the library's output silently.

Defaults: ``invalid="raise"``, ``no_deal="warn"``, ``indeterminate="warn"``,
``no_convergence="warn"``, ``internal="raise"``, ``precision="warn"``,
``implausible="warn"`` (the result
uses the value as given; ``errstate(implausible="ignore")`` turns the check off, e.g.
for arrays where such values are meant).  A call with scalar arguments only
always raises :class:`InvalidArgumentError` (a ``ValueError``) for invalid input; the
``invalid`` setting applies to array calls.
"""

from __future__ import annotations

import contextlib
import contextvars
from typing import Any, Dict, Iterator, Mapping

__all__ = [
    "CounterofferError",
    "InvalidArgumentError",
    "NoDealError",
    "IndeterminateError",
    "NoConvergenceError",
    "InternalError",
    "ImplausibleInputError",
    "PrecisionNotReachedError",
    "CounterofferWarning",
    "InvalidArgumentWarning",
    "NoDealWarning",
    "IndeterminateWarning",
    "NoConvergenceWarning",
    "InternalWarning",
    "ImplausibleInputWarning",
    "PrecisionNotReachedWarning",
    "errstate",
    "seterr",
    "geterr",
]


class CounterofferError(Exception):
    """Base class of the errors the package raises for a status of the library."""


class InvalidArgumentError(CounterofferError, ValueError):
    """An argument is NaN, infinite or outside its domain (status ``invalid``)."""


class NoDealError(CounterofferError):
    """No rational deal: the surplus does not exceed the no-deal payoffs (``no_deal``)."""


class IndeterminateError(CounterofferError):
    """The model has many equilibria, e.g. both factors 1 (``indeterminate``)."""


class NoConvergenceError(CounterofferError, ArithmeticError):
    """A numerical method of the library did not converge (``no_convergence``)."""


class InternalError(CounterofferError, RuntimeError):
    """A defect in the library (``internal``); please report it."""


class ImplausibleInputError(CounterofferError, ValueError):
    """A valid value outside its plausible range (with ``errstate(implausible="raise")``)."""


class PrecisionNotReachedError(CounterofferError, ArithmeticError):
    """share_range: some quantile is short of the digit target at the largest sample
    (with ``errstate(precision="raise")``)."""


class CounterofferWarning(UserWarning):
    """Base class of the warnings the package issues for a status of the library."""


class InvalidArgumentWarning(CounterofferWarning):
    """Invalid arguments gave NaN (with ``errstate(invalid="warn")``)."""


class NoDealWarning(CounterofferWarning):
    """No rational deal: the result is own's no-deal payoff, not a bargained share."""


class IndeterminateWarning(CounterofferWarning):
    """Many equilibria: the result is NaN."""


class NoConvergenceWarning(CounterofferWarning):
    """A numerical method did not converge: the result is NaN."""


class InternalWarning(CounterofferWarning):
    """A defect in the library gave NaN (with ``errstate(internal="warn")``)."""


class ImplausibleInputWarning(CounterofferWarning):
    """A valid value outside its plausible range, e.g. a rate typed as 8 for 8%: the
    result uses the value as given."""


class PrecisionNotReachedWarning(CounterofferWarning):
    """share_range: every estimate is reported with its half-width, but some quantile of
    own share is short of the digit target at the largest sample (status ``precision``)."""


#: category name -> (error class, warning class); unknown future statuses use the bases
CLASSES: Dict[str, Any] = {
    "invalid": (InvalidArgumentError, InvalidArgumentWarning),
    "no_deal": (NoDealError, NoDealWarning),
    "indeterminate": (IndeterminateError, IndeterminateWarning),
    "no_convergence": (NoConvergenceError, NoConvergenceWarning),
    "internal": (InternalError, InternalWarning),
    "implausible": (ImplausibleInputError, ImplausibleInputWarning),
    "precision": (PrecisionNotReachedError, PrecisionNotReachedWarning),
}

_ACTIONS = ("raise", "warn", "ignore")
_DEFAULTS: Dict[str, str] = {
    "invalid": "raise",
    "no_deal": "warn",
    "indeterminate": "warn",
    "no_convergence": "warn",
    "internal": "raise",
    "implausible": "warn",
    "precision": "warn",
}
_policy: contextvars.ContextVar[Dict[str, str]] = contextvars.ContextVar(
    "counteroffer_errstate", default=_DEFAULTS
)


def _checked(current: Mapping[str, str], settings: Mapping[str, Any]) -> Dict[str, str]:
    new = dict(current)
    for key, action in settings.items():
        if action is None:
            continue
        if key == "all":
            for k in new:
                new[k] = _check_action(key, action)
            continue
        if key not in new:
            raise TypeError(
                f"errstate: unknown category {key!r}; expected one of {', '.join(new)}, or all"
            )
        new[key] = _check_action(key, action)
    return new


def _check_action(key: str, action: Any) -> str:
    if action not in _ACTIONS:
        raise ValueError(
            f"errstate: {key} = {action!r} is invalid (one of 'raise', 'warn', 'ignore')"
        )
    return str(action)


def action(category: str) -> str:
    """The current action for one category (no copy of the policy: the hot path)."""
    return _policy.get().get(category, "raise")


def geterr() -> Dict[str, str]:
    """The current policy as a dict: category -> "raise" | "warn" | "ignore"."""
    return dict(_policy.get())


def seterr(
    *,
    all: str | None = None,
    invalid: str | None = None,
    no_deal: str | None = None,
    indeterminate: str | None = None,
    no_convergence: str | None = None,
    internal: str | None = None,
    implausible: str | None = None,
    precision: str | None = None,
) -> Dict[str, str]:
    """Set the policy for the current context; returns the previous one."""
    old = geterr()
    _policy.set(
        _checked(
            old,
            {"all": all, "invalid": invalid, "no_deal": no_deal, "indeterminate": indeterminate,
             "no_convergence": no_convergence, "internal": internal,
             "implausible": implausible, "precision": precision},
        )
    )
    return old


@contextlib.contextmanager
def errstate(
    *,
    all: str | None = None,
    invalid: str | None = None,
    no_deal: str | None = None,
    indeterminate: str | None = None,
    no_convergence: str | None = None,
    internal: str | None = None,
    implausible: str | None = None,
    precision: str | None = None,
) -> Iterator[Dict[str, str]]:
    """Context manager: the error policy inside the ``with`` block.

    >>> import counteroffer as co
    >>> with co.errstate(no_deal="raise"):
    ...     co.share(0.9, 0.9, surplus=-5.0)
    Traceback (most recent call last):
    ...
    counteroffer.NoDealError: share: no rational deal ...
    """
    new = _checked(
        _policy.get(),
        {"all": all, "invalid": invalid, "no_deal": no_deal, "indeterminate": indeterminate,
         "no_convergence": no_convergence, "internal": internal, "implausible": implausible,
         "precision": precision},
    )
    token = _policy.set(new)
    try:
        yield dict(new)
    finally:
        _policy.reset(token)
