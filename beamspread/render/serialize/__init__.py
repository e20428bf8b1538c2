"""JSON and CSV forms of results: SI values, unit-suffixed keys.

The JSON form of a beam result is a contract that scripts rely on; it is
documented in README.md ("JSON output") and checked by the tests.
"""
