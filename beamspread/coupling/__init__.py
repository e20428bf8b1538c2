"""Coupling a probe to the part: an angle-beam wedge, an immersion water path, a focus.

Each ``analyse_*`` function returns a :class:`~beamspread.coupling.result.SetupResult`:
the beam in the part as a :class:`beamspread.BeamResult` (half-angles and spots per
plane and leg), and what the setup adds (refraction, effective aperture, near field
in the part, transmission, focus). SI units, angles in radians at the inputs and
degrees in results, as elsewhere.

* :mod:`beamspread.coupling.wedge`: :class:`~beamspread.coupling.wedge.Wedge` and
  :func:`~beamspread.coupling.wedge.analyse_wedge`; its notes give the model of the
  beam under a wedge and its limits.
* :mod:`beamspread.coupling.crossing`: where a computed level edge crosses a depth
  (the root finder behind the wedge's computed footprints).
* :mod:`beamspread.coupling.immersion`: :class:`~beamspread.coupling.immersion.WaterPath`,
  :class:`~beamspread.coupling.immersion.Focus` and
  :func:`~beamspread.coupling.immersion.analyse_immersion`; its notes give the
  immersion and focus models and their limits.
* :mod:`beamspread.coupling.transmission`: plane-wave reflection and transmission
  coefficients at a flat fluid or solid interface (welded or slip), per angle.
* :mod:`beamspread.coupling.result`: the results (``SetupResult``, ``FocusResult``,
  ``WedgeFootprint``) and the computed widths kept along the sound path.
"""
