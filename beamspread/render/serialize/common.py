"""What every JSON and CSV form shares: unit-suffixed keys, clean values, the probe and medium."""

from __future__ import annotations

import csv
import io
import json
import math
from typing import Any

from ...media.quantities import Wave

_SUFFIX = {
    "degC": "c",
    "g/kg": "g_kg",
    "m": "m",
    "dbar": "dbar",
    "%": "percent",
    "m/s": "m_s",
    "kg/m3": "kg_m3",
    "": "",
}


def unit_suffix(unit: str) -> str:
    """The key suffix of a unit: "degC" -> "c", "g/kg" -> "g_kg"."""
    return _SUFFIX.get(unit, unit.replace("/", "_").replace(" ", "_").lower())


def _key(name: str, unit: str) -> str:
    suffix = unit_suffix(unit)
    return f"{name}_{suffix}" if suffix else name


def _clean(value: Any) -> Any:
    """Floats that are not finite become None, so the JSON never holds NaN."""
    if isinstance(value, float) and not math.isfinite(value):
        return None
    if isinstance(value, dict):
        return {k: _clean(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [_clean(v) for v in value]
    return value


def conditions_to_dict(wave: Wave) -> dict[str, float]:
    """A wave's conditions keyed with their units: ``{"temperature_c": 12.0}``."""
    return {
        _key(name, wave.condition_units.get(name, "")): value
        for name, value in wave.conditions.items()
    }


def wave_to_dict(wave: Wave) -> dict[str, Any]:
    """The ``medium`` object of the JSON contract."""
    out: dict[str, Any] = {
        "name": wave.medium,
        "wave": wave.wave,
        "speed_m_s": wave.speed,
        "source": wave.source,
        "state": wave.state,
        "conditions": conditions_to_dict(wave),
    }
    if wave.density is not None:
        out["density_kg_m3"] = wave.density
        out["impedance_rayl"] = wave.density * wave.speed
    return out


def field_settings_to_dict(settings, mode: str) -> dict[str, Any]:
    """How a computed field was formed: the ``field`` object of the JSON forms."""
    return {
        "mode": mode,
        "bandwidth": settings.bandwidth,
        "spectrum": settings.spectrum if settings.bandwidth > 0 else "continuous wave",
        "frequencies": settings.frequencies if settings.bandwidth > 0 else 1,
        "amplitude": settings.amplitude,
    }


def dumps(data: Any) -> str:
    """JSON text as beamspread writes it: indented, no NaN allowed."""
    return json.dumps(data, indent=2, allow_nan=False)


def _cell(value: Any) -> Any:
    if value is None:
        return ""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, float):
        return repr(value)
    return value


def probe_to_dict(probe) -> dict[str, Any]:
    """The ``probe`` object of the JSON forms."""
    return {"shape": probe.shape, **probe.dimensions(), "frequency_hz": probe.frequency}


def amplitude_unit(mode: str) -> str:
    return "(rho c U0)^2" if mode == "pulse-echo" else "rho c U0"


def _db(amplitude, reference: float):
    import numpy as np

    with np.errstate(divide="ignore"):
        level = 20.0 * np.log10(np.asarray(amplitude) / reference)
    return [None if not math.isfinite(v) else float(v) for v in level]


def _csv(header, rows) -> str:
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(header)
    for row in rows:
        writer.writerow([_cell(v) for v in row])
    return buffer.getvalue()
