"""Sonar figures of a flat piston: directivity index, side lobes, footprints, echo budget."""
