"""``python -m beamspread`` runs the command line."""

from .cli import main

main()
