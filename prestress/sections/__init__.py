"""Sections: the library of shapes, their geometry and their properties.

Pipeline: ``library`` (find a named shape) → ``families`` (build its shapely polygon)
→ ``properties`` (gross properties through sectionproperties, cached on disk)
→ ``composite`` (deck, haunch and strands assembled by the parallel-axis theorem).
"""
