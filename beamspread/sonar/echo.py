"""The echo budget of a sonar: source level, spreading, absorption and bottom loss."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..errors import InputError
from ..probes import check_positive

_SEAWATER_IMPEDANCE = 1.5e6  # rayl: rho c of seawater in the common sonar-equation constant


def source_level_constant(impedance: float = _SEAWATER_IMPEDANCE) -> float:
    """The constant of the source-level formula, dB re 1 uPa at 1 m for 1 W radiated.

    :math:`10\\log_{10}(\\rho c\\, 10^{12} / 4\\pi)`: 1 W spread over a sphere
    gives :math:`I = 1/(4\\pi)` W/m2 at 1 m, :math:`p^2 = \\rho c I`, in uPa^2.
    With seawater's :math:`\\rho c \\approx 1.5\\times10^6` rayl this is the
    170.8 dB of the common sonar-equation form.

    >>> round(source_level_constant(), 1)
    170.8
    """
    impedance = check_positive(impedance, "impedance", "rayl")
    return 10.0 * math.log10(impedance * 1e12 / (4.0 * math.pi))


def source_level(power, efficiency, directivity_index_db, constant: float = 170.8):
    """Source level, dB re 1 uPa at 1 m: ``170.8 + 10 log10 P + 10 log10 eta + DI``.

    Parameters
    ----------
    power : array_like
        Electrical power into the transducer, W.
    efficiency : array_like
        Electro-acoustic efficiency, 0 to 1.
    directivity_index_db : array_like
        dB.
    constant : float
        170.8 for seawater (the common sonar-equation form); see
        :func:`source_level_constant` for other media.
    """
    p = np.asarray(power, dtype=float)
    eta = np.asarray(efficiency, dtype=float)
    if np.any(~np.isfinite(p)) or np.any(p <= 0):
        raise InputError("power: give the electrical power in W, above 0")
    if np.any(~np.isfinite(eta)) or np.any(eta <= 0) or np.any(eta > 1):
        raise InputError("efficiency: give a fraction above 0 and at most 1 (0.5 for 50 %)")
    return (
        constant
        + 10.0 * np.log10(p)
        + 10.0 * np.log10(eta)
        + np.asarray(directivity_index_db, dtype=float)
    )


@dataclass(frozen=True)
class Term:
    """One labelled term of an echo budget."""

    name: str
    value_db: float
    formula: str
    reference: str = "dB"


@dataclass(frozen=True)
class EchoBudget:
    """A bottom echo's level budget, each term labelled.

    ``received_level = source_level - spreading - absorption - bottom_loss``.
    """

    range_m: float
    source_level: Term
    spreading_loss: Term
    absorption_loss: Term
    bottom_loss: Term
    received_level: Term
    power_w: float = math.nan  # the inputs, for the record
    efficiency: float = math.nan

    @property
    def terms(self) -> tuple[Term, ...]:
        return (
            self.source_level,
            self.spreading_loss,
            self.absorption_loss,
            self.bottom_loss,
            self.received_level,
        )


def echo_budget(
    *,
    power: float,
    efficiency: float,
    directivity_index_db: float,
    range_m: float,
    absorption_db_per_km: float = 0.0,
    bottom_loss_db: float = 0.0,
    constant: float = 170.8,
) -> EchoBudget:
    """A simple sonar-equation budget for the echo of a bottom at ``range_m``.

    Parameters
    ----------
    power : float
        Electrical power, W.
    efficiency : float
        Electro-acoustic efficiency, above 0 and at most 1.
    directivity_index_db : float
        dB (see :func:`directivity_index`).
    range_m : float
        Range to the bottom, m (at least 1 m, the reference distance).
    absorption_db_per_km : float
        The medium's absorption at the frequency, dB/km.
    bottom_loss_db : float
        Reflection loss of the bottom, dB (0 for a perfect reflector).
    constant : float
        The source-level constant, 170.8 for seawater.

    Returns
    -------
    EchoBudget
        Source level :math:`SL = 170.8 + 10\\log_{10}P + 10\\log_{10}\\eta + DI`
        (dB re 1 uPa at 1 m, the common sonar-equation form), spherical spreading
        over the two-way path :math:`20\\log_{10}(2R)`, two-way absorption
        :math:`2\\alpha R`, the bottom loss, and the received level, dB re 1 uPa.

    Notes
    -----
    A flat bottom reflects like a mirror: the echo is the field of the image
    source, 2R away, times the reflection coefficient (method of images), so
    the spreading is :math:`20\\log_{10}(2R)` and the bottom enters as its
    reflection loss :math:`-20\\log_{10}|V|`. This holds for a smooth bottom
    that is flat over the beam's footprint; a rough bottom scatters, and
    returns less than this to the transducer. The point-target form
    :math:`40\\log_{10}R` belongs with a target strength, not with a
    reflection loss, and is not used here.

    Examples
    --------
    >>> b = echo_budget(power=100, efficiency=0.5, directivity_index_db=20,
    ...                 range_m=100, absorption_db_per_km=50, bottom_loss_db=15)
    >>> [round(t.value_db, 1) for t in b.terms]
    [207.8, 46.0, 10.0, 15.0, 136.8]
    """
    range_m = check_positive(range_m, "range", "m")
    if range_m < 1.0:
        raise InputError(
            f"range: {range_m:g} m lies inside the 1 m reference distance of the "
            "source level; give a range of at least 1 m"
        )
    for value, name in ((absorption_db_per_km, "absorption"), (bottom_loss_db, "bottom loss")):
        if not math.isfinite(value) or value < 0:
            raise InputError(f"{name}: {value!r} dB is not allowed; give 0 or more")
    sl = float(source_level(power, efficiency, directivity_index_db, constant))
    spreading = 20.0 * math.log10(2.0 * range_m)
    absorption = 2.0 * absorption_db_per_km * range_m / 1e3
    received = sl - spreading - absorption - bottom_loss_db
    return EchoBudget(
        range_m=range_m,
        power_w=float(power),
        efficiency=float(efficiency),
        source_level=Term(
            "source level",
            sl,
            f"{constant:g} + 10 log10(P) + 10 log10(eta) + DI",
            "dB re 1 uPa at 1 m",
        ),
        spreading_loss=Term("two-way spreading loss", spreading, "20 log10(2R / 1 m)"),
        absorption_loss=Term("two-way absorption loss", absorption, "2 alpha R"),
        bottom_loss=Term("bottom reflection loss", float(bottom_loss_db), "given"),
        received_level=Term(
            "received echo level", received, "SL - 20 log10 2R - 2 alpha R - BL", "dB re 1 uPa"
        ),
    )
