"""The library of published load models and the files users write: reading, writing, adjusting."""
