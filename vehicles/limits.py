"""How large a request may be: a table, a train's ranged values; beyond this it is refused
before any of it is built."""

MAX_TABLE_ROWS = 1_000_000
"""The most rows of one tabulated sweep or influence line (one per load or lead position): a
finer table would not fit this machine's memory, nor serve a reader."""

MAX_RANGED = 6
"""The most ranged gaps and lengths of one train: the numeric search for their governing values
starts from a grid of 3 values a range (729 effect functions for 6, some seconds a section)."""
