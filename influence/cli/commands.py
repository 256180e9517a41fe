"""Registers every command module with the ``influence`` group."""
