"""Inverse design: the element size (or frequency) that gives a wanted beam."""
