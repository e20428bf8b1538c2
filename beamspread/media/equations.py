"""Published sound-speed equations for water, seawater and air.

Each function takes its conditions by keyword in the units it names and
returns m/s (or kg/m3 for densities). They broadcast over numpy arrays. The
valid ranges are declared where the media are built, in
:mod:`beamspread.media.builtin`.
"""

from __future__ import annotations

import numpy as np

__all__ = [
    "air_density_ideal",
    "air_speed_ideal",
    "seawater_mackenzie",
    "water_bilaniuk_wong",
    "water_density_kell",
    "water_marczak",
]

# Marczak (1997), J. Acoust. Soc. Am. 102, 2776: pure water, ITS-90, 0-95 degC.
_MARCZAK = (1402.385, 5.038813, -5.799136e-2, 3.287156e-4, -1.398845e-6, 2.787860e-9)
# Bilaniuk & Wong (1993, erratum 1996), J. Acoust. Soc. Am. 93, 1609 and 99, 3257:
# the 148-point fit, ITS-90, 0-100 degC.
_BILANIUK_WONG = (
    1402.38744, 5.03836171, -5.81172916e-2, 3.34638117e-4, -1.48259672e-6, 3.16585020e-9,
)


def _polynomial(coefficients, t):
    return np.polynomial.polynomial.polyval(np.asarray(t, dtype=float), coefficients)


def water_marczak(temperature):
    """Speed of sound in pure water at atmospheric pressure, m/s (temperature in degC, ITS-90).

    Marczak, "Water as a standard in the measurements of speed of sound in
    liquids", J. Acoust. Soc. Am. 102, 2776 (1997); fitted for 0-95 degC.

    >>> round(float(water_marczak(20.0)), 2)
    1482.38
    """
    return _polynomial(_MARCZAK, temperature)


def water_bilaniuk_wong(temperature):
    """Speed of sound in pure water at atmospheric pressure, m/s (degC, ITS-90).

    Bilaniuk & Wong, J. Acoust. Soc. Am. 93, 1609 (1993), erratum 99, 3257
    (1996): the 148-point fit, 0-100 degC.
    """
    return _polynomial(_BILANIUK_WONG, temperature)


def water_density_kell(temperature):
    """Density of air-free water at 1 atm, kg/m3 (degC), Kell's rational fit.

    G. S. Kell, J. Chem. Eng. Data 20, 97 (1975), 0-150 degC (coefficients
    from memory; the tests check the result against IAPWS-95).
    """
    t = np.asarray(temperature, dtype=float)
    numerator = _polynomial(
        (999.83952, 16.945176, -7.9870401e-3, -46.170461e-6, 105.56302e-9, -280.54253e-12), t
    )
    return numerator / (1.0 + 16.879850e-3 * t)


def seawater_mackenzie(temperature, salinity, depth):
    """Speed of sound in seawater, m/s: Mackenzie's nine-term equation.

    K. V. Mackenzie, "Nine-term equation for sound speed in the oceans",
    J. Acoust. Soc. Am. 70, 807 (1981). Temperature in degC, salinity in
    parts per thousand, depth in m; fitted for -2 to 30 degC, 25 to 40 ppt and
    0 to 8000 m.

    >>> round(float(seawater_mackenzie(25.0, 35.0, 1000.0)), 3)
    1550.744
    """
    t = np.asarray(temperature, dtype=float)
    s = np.asarray(salinity, dtype=float) - 35.0
    d = np.asarray(depth, dtype=float)
    return (
        1448.96
        + 4.591 * t
        - 5.304e-2 * t**2
        + 2.374e-4 * t**3
        + 1.340 * s
        + 1.630e-2 * d
        + 1.675e-7 * d**2
        - 1.025e-2 * t * s
        - 7.139e-13 * t * d**3
    )


_KELVIN = 273.15
_DRY_AIR_GAS_CONSTANT = 287.05  # J/(kg K), dry air (common practice)
_STANDARD_PRESSURE = 101325.0  # Pa


def air_speed_ideal(temperature):
    """Speed of sound in dry air, m/s: the ideal-gas form 331.3 sqrt(1 + T/273.15).

    Common practice; Cramer (1993) gives 331.45 m/s at 0 degC for dry air
    with 314 ppm CO2, 0.05 % above this form.
    """
    t = np.asarray(temperature, dtype=float)
    return 331.3 * np.sqrt(1.0 + t / _KELVIN)


def air_density_ideal(temperature):
    """Density of dry air at 101.325 kPa from the ideal-gas law, kg/m3 (degC)."""
    t = np.asarray(temperature, dtype=float)
    return _STANDARD_PRESSURE / (_DRY_AIR_GAS_CONSTANT * (t + _KELVIN))
