"""Describing load models to people: text, tables and drawings (matplotlib only in figures)."""
