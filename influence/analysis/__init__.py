"""From a model to exact influence lines: singularity terms, member laws, one factorisation,
responses as weights, and the influence lines themselves."""
