"""Exact influence lines for girders, frames and trusses, built from singularity functions."""
