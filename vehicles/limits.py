"""How large a tabulated result may be: a request beyond this is refused before it is built."""

MAX_TABLE_ROWS = 1_000_000
"""The most rows of one tabulated sweep or influence line (one per load or lead position): a
finer table would not fit this machine's memory, nor serve a reader."""
