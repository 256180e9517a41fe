"""The structure as the user describes it: nodes, members, supports, the travel path, the
compact beam form, and the one reader of model files (structure and design basis together)."""
