"""``python -m prestress`` runs the command line."""

import sys

from prestress.cli import main

sys.exit(main())
