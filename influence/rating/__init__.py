"""Load rating, posting and permit checks on plain numbers (AASHTO MBE: LRFR, LFR, ASR)."""
