"""Plain-text tables for people: every table states its convention."""
