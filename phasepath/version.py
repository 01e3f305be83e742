"""The version of phasepath (kept in one place; results files and reports record it)."""

__version__ = "0.2.0"
