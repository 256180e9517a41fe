"""The structure as the user describes it: nodes, members, supports, the travel path, the
compact beam and truss forms, typed keys and quantities, and the one reader of model files
(structure, design basis, project, rating and fatigue tables together)."""
