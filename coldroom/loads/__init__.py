"""Heat-load components of a refrigerated room (pure functions, SI)."""
