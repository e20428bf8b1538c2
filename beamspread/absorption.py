"""Sound absorption in seawater, fresh water and air, in dB per kilometre.

Each function takes the frequency in Hz (SI, like the rest of the core) and
the conditions in the units its equation names, broadcasts over numpy arrays
and returns the absorption coefficient :math:`\\alpha` in dB/km. The media of
:mod:`beamspread.media.builtin` wire these functions as their ``absorption``;
:meth:`beamspread.ComputedMedium.absorption_db_per_km` fills the defaults and
checks the ranges.

Seawater (three relaxation terms, :math:`f` in kHz):

.. math:: \\alpha = \\frac{A_1 P_1 f_1 f^2}{f_1^2 + f^2}
   + \\frac{A_2 P_2 f_2 f^2}{f_2^2 + f^2} + A_3 P_3 f^2

the boric acid, magnesium sulphate and pure-water contributions of
Francois & Garrison (1982); Ainslie & McColm (1998) give a simpler form of
the same three terms, within about 10 % of it.

References
----------
R. E. Francois and G. R. Garrison, "Sound absorption based on ocean
measurements. Part I: Pure water and magnesium sulfate contributions",
J. Acoust. Soc. Am. 72, 896 (1982); "Part II: Boric acid contribution and
equation for total absorption", J. Acoust. Soc. Am. 72, 1879 (1982).
M. A. Ainslie and J. G. McColm, "A simplified formula for viscous and
chemical absorption in sea water", J. Acoust. Soc. Am. 103, 1671 (1998).
ISO 9613-1:1993, *Acoustics - Attenuation of sound during propagation
outdoors - Part 1: Calculation of the absorption of sound by the atmosphere*.
"""

from __future__ import annotations

import numpy as np

__all__ = [
    "AINSLIE_MCCOLM",
    "FRANCOIS_GARRISON",
    "FRESH_WATER",
    "ISO_9613_1",
    "ainslie_mccolm",
    "air_iso9613",
    "francois_garrison",
    "francois_garrison_terms",
    "fresh_water",
]

FRANCOIS_GARRISON = (
    "Francois & Garrison (1982), J. Acoust. Soc. Am. 72, 896 and 1879: boric acid, "
    "magnesium sulphate and pure-water terms"
)
AINSLIE_MCCOLM = (
    "Ainslie & McColm (1998), J. Acoust. Soc. Am. 103, 1671: simplified boric acid, "
    "magnesium sulphate and viscous terms"
)
FRESH_WATER = "pure-water (viscous) term of Francois & Garrison (1982), J. Acoust. Soc. Am. 72, 896"
ISO_9613_1 = (
    "ISO 9613-1:1993, atmospheric absorption: classical term and the oxygen and nitrogen "
    "relaxations"
)


def _khz(frequency) -> np.ndarray:
    return np.asarray(frequency, dtype=float) / 1e3


def _pure_water_a3(temperature):
    """Francois & Garrison's A3 in dB/(km kHz^2), with its two temperature branches."""
    t = np.asarray(temperature, dtype=float)
    cold = 4.937e-4 - 2.59e-5 * t + 9.11e-7 * t**2 - 1.50e-8 * t**3
    warm = 3.964e-4 - 1.146e-5 * t + 1.45e-7 * t**2 - 6.5e-10 * t**3
    return np.where(t <= 20.0, cold, warm)


def _pure_water_p3(depth):
    z = np.asarray(depth, dtype=float)
    return 1.0 - 3.83e-5 * z + 4.9e-10 * z * z


def francois_garrison_terms(frequency, temperature=10.0, salinity=35.0, depth=0.0, ph=8.0):
    """The three contributions of Francois & Garrison (1982), each in dB/km.

    Parameters
    ----------
    frequency : array_like
        Hz.
    temperature : array_like
        degC (the paper's absolute temperature is 273 + T).
    salinity : array_like
        Parts per thousand.
    depth : array_like
        m.
    ph : array_like

    Returns
    -------
    (boric, magnesium, water) : tuple of ndarray
        Boric acid, magnesium sulphate and pure-water terms, dB/km.

    Notes
    -----
    With :math:`f` in kHz, :math:`\\theta = 273 + T` and the paper's sound
    speed :math:`c = 1412 + 3.21 T + 1.19 S + 0.0167 z`:

    * boric acid: :math:`A_1 = 8.86/c \\cdot 10^{0.78\\,pH - 5}`, :math:`P_1 = 1`,
      :math:`f_1 = 2.8 \\sqrt{S/35}\\, 10^{4 - 1245/\\theta}`;
    * magnesium sulphate: :math:`A_2 = 21.44\\, S/c\\, (1 + 0.025 T)`,
      :math:`P_2 = 1 - 1.37\\times10^{-4} z + 6.2\\times10^{-9} z^2`,
      :math:`f_2 = 8.17\\times10^{8 - 1990/\\theta} / (1 + 0.0018 (S - 35))`;
    * pure water: :math:`P_3 = 1 - 3.83\\times10^{-5} z + 4.9\\times10^{-10} z^2`,
      :math:`A_3 = 4.937\\times10^{-4} - 2.59\\times10^{-5} T + 9.11\\times10^{-7} T^2
      - 1.50\\times10^{-8} T^3` for :math:`T \\le 20` degC, else
      :math:`3.964\\times10^{-4} - 1.146\\times10^{-5} T + 1.45\\times10^{-7} T^2
      - 6.5\\times10^{-10} T^3`.
    """
    f = _khz(frequency)
    t = np.asarray(temperature, dtype=float)
    s = np.asarray(salinity, dtype=float)
    z = np.asarray(depth, dtype=float)
    ph = np.asarray(ph, dtype=float)
    theta = 273.0 + t
    c = 1412.0 + 3.21 * t + 1.19 * s + 0.0167 * z
    f2_ = f * f
    a1 = 8.86 / c * 10.0 ** (0.78 * ph - 5.0)
    f1 = 2.8 * np.sqrt(s / 35.0) * 10.0 ** (4.0 - 1245.0 / theta)
    a2 = 21.44 * s / c * (1.0 + 0.025 * t)
    p2 = 1.0 - 1.37e-4 * z + 6.2e-9 * z * z
    fm = 8.17 * 10.0 ** (8.0 - 1990.0 / theta) / (1.0 + 0.0018 * (s - 35.0))
    boric = a1 * f1 * f2_ / (f1 * f1 + f2_)
    magnesium = a2 * p2 * fm * f2_ / (fm * fm + f2_)
    water = _pure_water_a3(t) * _pure_water_p3(z) * f2_
    return boric, magnesium, water


def francois_garrison(frequency, temperature=10.0, salinity=35.0, depth=0.0, ph=8.0):
    """Absorption in seawater, dB/km: Francois & Garrison (1982).

    Frequency in Hz, temperature in degC, salinity in parts per thousand,
    depth in m. See :func:`francois_garrison_terms` for the formula.

    Examples
    --------
    >>> a = francois_garrison(200e3, 10.0, 35.0, 0.0, 8.0)
    >>> 50 < float(a) < 70
    True
    """
    boric, magnesium, water = francois_garrison_terms(frequency, temperature, salinity, depth, ph)
    return boric + magnesium + water


def ainslie_mccolm(frequency, temperature=10.0, salinity=35.0, depth=0.0, ph=8.0):
    """Absorption in seawater, dB/km: the simplified formula of Ainslie & McColm (1998).

    Notes
    -----
    With :math:`f` in kHz and the depth :math:`z` in km:

    .. math:: \\alpha = 0.106 \\frac{f_1 f^2}{f_1^2 + f^2} e^{(pH - 8)/0.56}
       + 0.52 \\left(1 + \\frac{T}{43}\\right)\\frac{S}{35}\\frac{f_2 f^2}{f_2^2 + f^2}
       e^{-z/6} + 0.00049 f^2 e^{-(T/27 + z/17)}

    with :math:`f_1 = 0.78 \\sqrt{S/35}\\, e^{T/26}` and
    :math:`f_2 = 42 e^{T/17}` kHz. The authors give it as within about 10 % of
    Francois & Garrison from 100 Hz to 1 MHz for -6 to 35 degC, salinity 5 to
    50, pH 7.7 to 8.3 and depths to 7 km.
    """
    f = _khz(frequency)
    t = np.asarray(temperature, dtype=float)
    s = np.asarray(salinity, dtype=float)
    z = np.asarray(depth, dtype=float) / 1e3
    ph = np.asarray(ph, dtype=float)
    f2_ = f * f
    f1 = 0.78 * np.sqrt(s / 35.0) * np.exp(t / 26.0)
    fm = 42.0 * np.exp(t / 17.0)
    boric = 0.106 * f1 * f2_ / (f1 * f1 + f2_) * np.exp((ph - 8.0) / 0.56)
    magnesium = 0.52 * (1.0 + t / 43.0) * (s / 35.0) * fm * f2_ / (fm * fm + f2_) * np.exp(-z / 6.0)
    water = 0.00049 * f2_ * np.exp(-(t / 27.0 + z / 17.0))
    return boric + magnesium + water


def fresh_water(frequency, temperature=20.0, depth=0.0):
    """Absorption in fresh water, dB/km: the pure-water term of Francois & Garrison (1982).

    :math:`\\alpha = A_3(T) P_3(z) f^2` with :math:`f` in kHz (see
    :func:`francois_garrison_terms`). Dissolved salts, which dominate in the
    sea below about 1 MHz, are absent; in a lake with hard water the true
    absorption at low frequencies is somewhat higher.

    >>> round(float(fresh_water(1e6, 20.0)) / 1e3, 3)  # dB/m at 1 MHz, 20 degC
    0.22
    """
    f = _khz(frequency)
    return _pure_water_a3(temperature) * _pure_water_p3(depth) * f * f


_T_REF = 293.15  # K, ISO 9613-1 reference temperature
_T_TRIPLE = 273.16  # K, triple point of water
_P_REF = 101.325  # kPa, ISO 9613-1 reference pressure


def air_iso9613(frequency, temperature=20.0, humidity=50.0, pressure=101.325):
    """Atmospheric absorption, dB/km: ISO 9613-1:1993.

    Parameters
    ----------
    frequency : array_like
        Hz.
    temperature : array_like
        degC.
    humidity : array_like
        Relative humidity, %.
    pressure : array_like
        Atmospheric pressure, kPa.

    Notes
    -----
    With :math:`T` in kelvin, :math:`T_0 = 293.15` K, :math:`T_{01} = 273.16` K,
    :math:`p_r = 101.325` kPa, the molar concentration of water vapour
    :math:`h = h_r (p_{sat}/p_r)(p_a/p_r)^{-1}` in % with
    :math:`\\log_{10}(p_{sat}/p_r) = -6.8346 (T_{01}/T)^{1.261} + 4.6151`, the
    relaxation frequencies of oxygen and nitrogen

    .. math:: f_{rO} = \\frac{p_a}{p_r}\\left(24 + 4.04\\times10^4 h
       \\frac{0.02 + h}{0.391 + h}\\right), \\quad
       f_{rN} = \\frac{p_a}{p_r}\\left(\\frac{T}{T_0}\\right)^{-1/2}
       \\left(9 + 280 h\\, e^{-4.170[(T/T_0)^{-1/3} - 1]}\\right)

    and, in dB/m,

    .. math:: \\alpha = 8.686 f^2 \\left[1.84\\times10^{-11} \\frac{p_r}{p_a}
       \\left(\\frac{T}{T_0}\\right)^{1/2} + \\left(\\frac{T}{T_0}\\right)^{-5/2}
       \\left(\\frac{0.01275\\, e^{-2239.1/T}}{f_{rO} + f^2/f_{rO}}
       + \\frac{0.1068\\, e^{-3352.0/T}}{f_{rN} + f^2/f_{rN}}\\right)\\right].
    """
    f = np.asarray(frequency, dtype=float)
    kelvin = np.asarray(temperature, dtype=float) + 273.15
    pa = np.asarray(pressure, dtype=float) / _P_REF
    tr = kelvin / _T_REF
    psat = 10.0 ** (-6.8346 * (_T_TRIPLE / kelvin) ** 1.261 + 4.6151)
    h = np.asarray(humidity, dtype=float) * psat / pa
    fro = pa * (24.0 + 4.04e4 * h * (0.02 + h) / (0.391 + h))
    frn = pa * tr**-0.5 * (9.0 + 280.0 * h * np.exp(-4.170 * (tr ** (-1.0 / 3.0) - 1.0)))
    f2_ = f * f
    classical = 1.84e-11 / pa * np.sqrt(tr)
    oxygen = 0.01275 * np.exp(-2239.1 / kelvin) / (fro + f2_ / fro)
    nitrogen = 0.1068 * np.exp(-3352.0 / kelvin) / (frn + f2_ / frn)
    return 8.686 * f2_ * (classical + tr**-2.5 * (oxygen + nitrogen)) * 1e3
