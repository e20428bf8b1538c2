"""One-line captions that name a result's inputs, for pictures and pages."""

from __future__ import annotations

__all__ = ["caption_of", "frequency_text"]


def frequency_text(hertz: float) -> str:
    """A frequency as people write it: 5 MHz, 200 kHz."""
    return f"{hertz / 1e6:g} MHz" if hertz >= 1e6 else f"{hertz / 1e3:g} kHz"


def caption_of(result) -> str:
    """A one-line caption naming the inputs of a :class:`beamspread.BeamResult`."""
    p, w = result.probe, result.wave
    size = p.caption()
    where = "given speed" if w.medium == "given" else w.medium
    return (
        f"{size}, {frequency_text(p.frequency)}; {where}, {w.wave} {w.speed:.1f} m/s; "
        f"{result.convention.mode}; beamspread model estimate"
    )
