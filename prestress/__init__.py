"""prestress: stage-by-stage checks of prestressed concrete girders.

The engine works in one internal unit system (newton, millimetre, MPa, day);
see ``DEVELOPERS.md``. Sign convention: tension positive, compression negative.
"""

__version__ = "0.1.0"
