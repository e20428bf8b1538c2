"""Element types: the flat circular and rectangular pistons, and the ellipse a disc looks like.

An element is geometry plus a centre frequency, in SI units. Values are
checked (positive, finite) when the element is made, so everything downstream
may assume them sound. Each type answers for itself (:class:`Element`): its
planes, far-field pattern, near field, field-engine boundary, symmetry, focus
and the element it looks like through a wedge; :func:`check_element` refuses
anything else.

- ``_base.py``: :class:`Element`, the shared checks and the register of types
- ``disc.py``: :class:`Disc`
- ``sided.py``: :class:`Rectangle` and :class:`Ellipse`
"""

from .._checks import check_positive
from ._base import (
    Element,
    NearField,
    WedgeView,
    check_element,
    check_sizes,
    element_class,
    kinds,
    plane_name,
)
from .disc import Disc
from .sided import Ellipse, Rectangle

__all__ = [
    "Disc",
    "Element",
    "Ellipse",
    "NearField",
    "Probe",
    "Rectangle",
    "WedgeView",
    "check_element",
    "check_positive",
    "check_sizes",
    "element_class",
    "kinds",
    "plane_name",
]

Probe = Disc | Rectangle | Ellipse
