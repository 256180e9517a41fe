"""What designers do with influence lines: governing placements at a section, dead-load effects,
envelope sections, envelopes with combinations, and the deflection check."""
