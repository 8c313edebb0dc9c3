"""Loads and actions on the girder (engine level, internal units)."""
