"""Exact placement of load trains on influence lines: lines prepared in batches, the terms of a
case, effect functions, ranged values, the one governing search, sweeps and concurrent effects.
"""
