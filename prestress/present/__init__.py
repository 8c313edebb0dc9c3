"""Presenters: console tables, JSON and other outputs of the results."""
