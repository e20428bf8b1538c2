"""The edge that turns results into text, JSON, CSV and pictures; it never computes physics."""
