"""Published sound-speed equations for water, seawater and air, and the conversions they need.

Each function takes its conditions by keyword in the units it names and
returns m/s (or kg/m3 for densities). They broadcast over numpy arrays. The
valid ranges are declared where the media are built, in
:mod:`beamspread.media.builtin`.
"""

from __future__ import annotations

import numpy as np

__all__ = [
    "air_cramer",
    "air_density_humid",
    "air_density_ideal",
    "air_speed_ideal",
    "depth_from_pressure_saunders",
    "pressure_from_depth_saunders",
    "seawater_del_grosso",
    "seawater_mackenzie",
    "seawater_unesco",
    "t68_from_t90",
    "water_bilaniuk_wong",
    "water_density_kell",
    "water_marczak",
    "water_vapour_mole_fraction",
]

# Marczak (1997), J. Acoust. Soc. Am. 102, 2776: pure water, ITS-90, 0-95 degC.
_MARCZAK = (1402.385, 5.038813, -5.799136e-2, 3.287156e-4, -1.398845e-6, 2.787860e-9)
# Bilaniuk & Wong (1993, erratum 1996), J. Acoust. Soc. Am. 93, 1609 and 99, 3257:
# the 148-point fit, ITS-90, 0-100 degC.
_BILANIUK_WONG = (
    1402.38744,
    5.03836171,
    -5.81172916e-2,
    3.34638117e-4,
    -1.48259672e-6,
    3.16585020e-9,
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


# ----------------------------------------------------------------- seawater, UNESCO

# Chen & Millero (1977), J. Acoust. Soc. Am. 62, 1129, as coded by Fofonoff & Millard (1983),
# UNESCO Tech. Pap. Mar. Sci. 44, eqs. 33-37 (IPTS-68 temperature, pressure in bar gauge).
# Each row is one power of pressure; within a row, ascending powers of temperature.
_CM_CW = (
    (1402.388, 5.03711, -5.80852e-2, 3.3420e-4, -1.47800e-6, 3.1464e-9),
    (0.153563, 6.8982e-4, -8.1788e-6, 1.3621e-7, -6.1185e-10),
    (3.1260e-5, -1.7107e-6, 2.5974e-8, -2.5335e-10, 1.0405e-12),
    (-9.7729e-9, 3.8504e-10, -2.3643e-12),
)
_CM_A = (
    (1.389, -1.262e-2, 7.164e-5, 2.006e-6, -3.21e-8),
    (9.4742e-5, -1.2580e-5, -6.4885e-8, 1.0507e-8, -2.0122e-10),
    (-3.9064e-7, 9.1041e-9, -1.6002e-10, 7.988e-12),
    (1.100e-10, 6.649e-12, -3.389e-13),
)
_CM_B = ((-1.922e-2, -4.42e-5), (7.3637e-5, 1.7945e-7))
_CM_D = ((1.727e-3,), (-7.9836e-6,))


def _double_polynomial(rows, t, p):
    """Sum over i of p**i * polyval(rows[i], t)."""
    return sum(_polynomial(row, t) * p**i for i, row in enumerate(rows))


def t68_from_t90(temperature):
    """IPTS-68 temperature from ITS-90, degC: ``T68 = 1.00024 T90``.

    The conversion Fofonoff & Millard's successors (and the UNESCO algorithms
    since 1990) use for the sea-water equations fitted on IPTS-68.
    """
    return 1.00024 * np.asarray(temperature, dtype=float)


def seawater_unesco(temperature, salinity, pressure):
    """Speed of sound in seawater, m/s: the UNESCO equation.

    C.-T. Chen and F. J. Millero, "Speed of sound in seawater at high
    pressures", J. Acoust. Soc. Am. 62, 1129 (1977), as coded by N. P.
    Fofonoff and R. C. Millard, UNESCO Tech. Pap. Mar. Sci. 44 (1983),
    eqs. 33-37. Temperature in degC on ITS-90 (converted here to IPTS-68,
    ``T68 = 1.00024 T90``), practical salinity, pressure in dbar above the
    atmosphere (converted to bar, as the equation takes it). Fitted for 0 to
    40 degC, 0 to 40 and 0 to 10000 dbar.

    The published check value: 1731.995 m/s at S = 40, T68 = 40 degC and
    10000 dbar.

    >>> round(float(seawater_unesco(40.0 / 1.00024, 40.0, 10000.0)), 3)
    1731.995
    """
    t = t68_from_t90(temperature)
    s = np.asarray(salinity, dtype=float)
    p = np.asarray(pressure, dtype=float) / 10.0  # dbar -> bar
    cw = _double_polynomial(_CM_CW, t, p)
    a = _double_polynomial(_CM_A, t, p)
    b = _double_polynomial(_CM_B, t, p)
    d = _double_polynomial(_CM_D, t, p)
    return cw + a * s + b * s**1.5 + d * s * s


def pressure_from_depth_saunders(depth, latitude=45.0):
    """Sea pressure in dbar at ``depth`` m below the surface: Saunders (1981).

    P. M. Saunders, "Practical conversion of pressure to depth", J. Phys.
    Oceanogr. 11, 573 (1981):

    .. math:: p = \\frac{(1 - c_1) - \\sqrt{(1 - c_1)^2 - 8.84\\times10^{-6} z}}
       {4.42\\times10^{-6}}, \\quad c_1 = (5.92 + 5.25 \\sin^2\\varphi)\\times10^{-3}

    for a standard ocean (salinity 35, 0 degC) at latitude :math:`\\varphi`.

    >>> round(float(pressure_from_depth_saunders(7321.45, 30.0)), 1)
    7500.0
    """
    z = np.asarray(depth, dtype=float)
    s = np.sin(np.radians(np.asarray(latitude, dtype=float)))
    c1 = 5.92e-3 + 5.25e-3 * s * s
    return ((1.0 - c1) - np.sqrt((1.0 - c1) ** 2 - 8.84e-6 * z)) / 4.42e-6


def depth_from_pressure_saunders(pressure, latitude=45.0):
    """Depth in m at sea pressure ``pressure`` dbar: the inverse of Saunders (1981).

    Solves :math:`z = (1 - c_1) p - 2.21\\times10^{-6} p^2`, the quadratic that
    :func:`pressure_from_depth_saunders` inverts.
    """
    p = np.asarray(pressure, dtype=float)
    s = np.sin(np.radians(np.asarray(latitude, dtype=float)))
    c1 = 5.92e-3 + 5.25e-3 * s * s
    return (1.0 - c1) * p - 2.21e-6 * p * p


# ----------------------------------------------------------------- air, Cramer (1993)

# O. Cramer, "The variation of the specific heat ratio and the speed of sound in air with
# temperature, pressure, humidity, and CO2 concentration", J. Acoust. Soc. Am. 93, 2510 (1993):
# the speed coefficients a0..a15 of his Table III (t in degC, p in Pa, mole fractions).
_CRAMER = (
    331.5024,
    0.603055,
    -0.000528,
    51.471935,
    0.1495874,
    -0.000782,
    -1.82e-7,
    3.73e-8,
    -2.93e-10,
    -85.20931,
    -0.228525,
    5.91e-5,
    -2.835149,
    -2.15e-13,
    29.179762,
    0.000486,
)
# Cramer's appendix: enhancement factor f = 1.00062 + 3.14e-8 p + 5.6e-7 t^2 and saturation
# vapour pressure psv = exp(1.2811805e-5 T^2 - 1.9509874e-2 T + 34.04926034 - 6.3536311e3 / T) Pa.
_ENHANCEMENT = (1.00062, 3.14e-8, 5.6e-7)
_SATURATION = (1.2811805e-5, -1.9509874e-2, 34.04926034, -6.3536311e3)


def water_vapour_mole_fraction(temperature, humidity, pressure):
    """Mole fraction of water vapour in air from relative humidity, as Cramer (1993) gives it.

    :math:`x_w = h\\, f(p, t)\\, p_{sv}(T) / p` with the enhancement factor
    :math:`f = 1.00062 + 3.14\\times10^{-8} p + 5.6\\times10^{-7} t^2` and the
    saturation vapour pressure :math:`p_{sv} = \\exp(1.2811805\\times10^{-5} T^2
    - 1.9509874\\times10^{-2} T + 34.04926034 - 6.3536311\\times10^{3}/T)` Pa
    (Cramer's appendix, after Giacomo and Davis). Temperature in degC, relative
    humidity in %, pressure in kPa.
    """
    t = np.asarray(temperature, dtype=float)
    kelvin = t + _KELVIN
    p = np.asarray(pressure, dtype=float) * 1e3
    f0, f1, f2 = _ENHANCEMENT
    enhancement = f0 + f1 * p + f2 * t * t
    s0, s1, s2, s3 = _SATURATION
    psv = np.exp(s0 * kelvin * kelvin + s1 * kelvin + s2 + s3 / kelvin)
    return np.asarray(humidity, dtype=float) / 100.0 * enhancement * psv / p


def air_cramer(temperature, humidity=0.0, pressure=101.325, co2=0.0314):
    """Zero-frequency speed of sound in air, m/s: Cramer's (1993) equation.

    Temperature in degC, relative humidity in %, pressure in kPa and the
    carbon dioxide mole fraction in % (Cramer's reference air: 0.0314 %, i.e.
    314 ppm). Fitted for 0 to 30 degC, 60 to 110 kPa, water vapour mole
    fractions up to 0.06 and CO2 up to 1 %.

    Cramer's reference value: 331.45 m/s for dry air at 0 degC and 101.325 kPa.

    >>> round(float(air_cramer(0.0)), 2)
    331.45
    """
    t = np.asarray(temperature, dtype=float)
    p = np.asarray(pressure, dtype=float) * 1e3
    xw = water_vapour_mole_fraction(t, humidity, pressure)
    xc = np.asarray(co2, dtype=float) / 100.0
    a = _CRAMER
    t2 = t * t
    return (
        a[0]
        + a[1] * t
        + a[2] * t2
        + (a[3] + a[4] * t + a[5] * t2) * xw
        + (a[6] + a[7] * t + a[8] * t2) * p
        + (a[9] + a[10] * t + a[11] * t2) * xc
        + a[12] * xw * xw
        + a[13] * p * p
        + a[14] * xc * xc
        + a[15] * xw * p * xc
    )


_MOLAR_GAS_CONSTANT = 8.314462618  # J/(mol K), CODATA exact
_MOLAR_MASS_DRY_AIR = 28.9647e-3  # kg/mol (common practice, from memory)
_MOLAR_MASS_WATER = 18.01528e-3  # kg/mol (common practice, from memory)


def air_density_humid(temperature, humidity=0.0, pressure=101.325, co2=0.0314):
    """Density of humid air from the ideal-gas law for the mixture, kg/m3.

    :math:`\\rho = p\\,[(1 - x_w) M_a + x_w M_w] / (R T)` with the water vapour
    mole fraction of :func:`water_vapour_mole_fraction` (common practice;
    compressibility, about 0.05 %, and the CO2 content are neglected).
    """
    del co2  # its effect on the molar mass is below the neglected compressibility
    t = np.asarray(temperature, dtype=float)
    xw = water_vapour_mole_fraction(t, humidity, pressure)
    molar = (1.0 - xw) * _MOLAR_MASS_DRY_AIR + xw * _MOLAR_MASS_WATER
    return np.asarray(pressure, dtype=float) * 1e3 * molar / (_MOLAR_GAS_CONSTANT * (t + _KELVIN))


# ----------------------------------------------------------------- seawater, Del Grosso

# V. A. Del Grosso, "New equation for the speed of sound in natural waters (with comparisons to
# other equations)", J. Acoust. Soc. Am. 56, 1084 (1974): the NRL II coefficients, IPTS-68
# temperature, pressure in kg/cm2 gauge. Checked against two independent copies (several
# circulating copies carry typos, and the ITS-90 refit of Wong & Zhu 1995 is a different set).
# As the paper groups them: C000, then the terms in T, S and P alone (coefficients of the first,
# second and third powers), then the cross terms keyed by their powers of (T, S, P).
_C000 = 1402.392
_C_T = (0.5012285e1, -0.551184e-1, 0.221649e-3)
_C_S = (0.1329530e1, 0.1288598e-3)
_C_P = (0.1560592, 0.2449993e-4, -0.8833959e-8)
_C_STP = {
    (1, 1, 0): -0.1275936e-1,
    (1, 0, 1): 0.6353509e-2,
    (2, 0, 2): 0.2656174e-7,
    (1, 0, 2): -0.1593895e-5,
    (1, 0, 3): 0.5222483e-9,
    (3, 0, 1): -0.4383615e-6,
    (0, 2, 2): -0.1616745e-8,
    (2, 1, 0): 0.9688441e-4,
    (1, 2, 1): 0.4857614e-5,
    (1, 1, 1): -0.3406824e-3,
}
# Every term keyed by its powers of (T, S, P), in the paper's order (the order of the sum).
_DEL_GROSSO = {
    (0, 0, 0): _C000,
    **{(n, 0, 0): c for n, c in enumerate(_C_T, 1)},
    **{(0, n, 0): c for n, c in enumerate(_C_S, 1)},
    **{(0, 0, n): c for n, c in enumerate(_C_P, 1)},
    **_C_STP,
}
_DBAR_PER_KGF_CM2 = 9.80665  # 1 kgf/cm2 = 98066.5 Pa


def seawater_del_grosso(temperature, salinity, pressure):
    """Speed of sound in seawater, m/s: Del Grosso's (1974) NRL II equation.

    Temperature in degC on ITS-90 (converted to IPTS-68), salinity in parts
    per thousand, pressure in dbar above the atmosphere (converted to the
    kg/cm2 gauge the equation takes). Fitted for 0 to 30 degC, 30 to 40 and 0
    to 1000 kg/cm2 (about 9800 dbar).
    """
    t = t68_from_t90(temperature)
    s = np.asarray(salinity, dtype=float)
    p = np.asarray(pressure, dtype=float) / _DBAR_PER_KGF_CM2
    return sum(c * t**i * s**j * p**k for (i, j, k), c in _DEL_GROSSO.items())
