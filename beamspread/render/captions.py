"""One-line captions that name a result's inputs, for pictures and pages."""

from __future__ import annotations

__all__ = ["caption_of", "frequency_text", "inputs_caption"]


def frequency_text(hertz: float) -> str:
    """A frequency as people write it: 5 MHz, 200 kHz."""
    return f"{hertz / 1e6:g} MHz" if hertz >= 1e6 else f"{hertz / 1e3:g} kHz"


def inputs_caption(probe, wave, convention: str) -> str:
    """A one-line caption naming the element, its frequency, the wave and ``convention``.

    ``convention`` is the mode, or the pulse and the mode.
    """
    size = probe.caption()
    where = "given speed" if wave.medium == "given" else wave.medium
    return (
        f"{size}, {frequency_text(probe.frequency)}; {where}, {wave.wave} {wave.speed:.1f} m/s; "
        f"{convention}; beamspread model estimate"
    )


def caption_of(result) -> str:
    """A one-line caption naming the inputs of a :class:`beamspread.BeamResult`."""
    return inputs_caption(result.probe, result.wave, result.convention.mode)
