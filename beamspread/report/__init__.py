"""Results to people and to scripts: text tables, JSON and CSV (pictures come later).

This is the only layer that formats; it reads result objects from the core.
"""
