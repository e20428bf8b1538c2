"""The edge that turns results into text, JSON, CSV and pictures.

Nothing here computes: the core's results come in, text and files go out.
"""
