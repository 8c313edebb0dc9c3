"""Bad-input corpus: each file under ``tests/corpus/`` holds one complete job, section library
or limit set with exactly ONE realistic mistake, and is named after it.

The contract checked for every case (README "The job file"; docs/job-file.md; prestress.cli):
exit status 2 and exactly one line on standard error, ``prestress: error: <file>: field
'<TOML path>': expected ...; got ...``, naming the file at fault, the field and what was
expected — never a traceback. Files that are not TOML at all (empty, truncated, not UTF-8)
have no field; their message must say where instead (line, end of document, byte offset).

Cases with ``bug=`` are defects of the package found by this corpus. They are strict xfails:
when the package is fixed the test XPASSes and fails, so the mark must be removed.

Layout of the corpus (README.md there): ``job-*.toml`` are copies of
``examples/brannoch-creek-span2-g3.toml`` with one mistake, using the copy of the shipped limit
set in ``limits/``; ``limits/limits-*.toml`` are bad limit-set files, checked through the valid
base job ``valid-base-job.toml``; each ``lib-*/`` folder holds a bad library in ``sections/``,
checked with ``prestress sections --library`` or through the folder's ``job.toml``.
"""

from __future__ import annotations

import os
import subprocess
import sys
from dataclasses import dataclass
from pathlib import Path

import pytest

from prestress.cli import main
from tests.conftest import ROOT

CORPUS = Path(__file__).resolve().parent / "corpus"
BASE_JOB = CORPUS / "valid-base-job.toml"
BASE_LIMITS = CORPUS / "limits" / "aashto-lrfd-9th-service.toml"
#: Files of the corpus that are not cases (valid support files and the folder's notes).
SUPPORT = {"valid-base-job.toml", "limits/aashto-lrfd-9th-service.toml", "README.md"}


@dataclass(frozen=True)
class Case:
    """One corpus case and what its message must contain.

    Attributes:
        path: corpus-relative path: a job file, a library folder, or a limit-set file.
        field: the TOML path the message must name (as ``field '<path>'``), or None for files
            that cannot be read as TOML at all.
        words: further words the message must contain (besides the file's path).
        run: "check" (a job), "sections" (``prestress sections --library path``) or "limits"
            (the valid base job with ``limits.file`` pointing at the limit-set file).
        file: the corpus-relative file the message must name, when not ``path`` itself.
        bug: a known defect of the package (strict xfail), in words.
    """

    path: str
    field: str | None
    words: list[str]
    run: str = "check"
    file: str | None = None
    bug: str | None = None

    @property
    def unit(self) -> str:
        """The corpus entry the case covers: a top-level file or folder, or a limits file."""
        return self.path if self.path.startswith("limits/") else self.path.split("/")[0]


CASES = [
    Case("job-missing-title.toml", "job.title", ["missing"]),
    Case("job-missing-section.toml", "girder.section", ["missing"]),
    Case("job-missing-length.toml", "girder.length", ["missing"]),
    Case("job-missing-span.toml", "girder.span", ["missing"]),
    Case(
        "job-missing-fci.toml",
        "girder.concrete.fci",
        ["missing"],
    ),
    Case(
        "job-missing-fc.toml",
        "girder.concrete.fc",
        ["missing"],
    ),
    Case(
        "job-missing-unit-weight.toml",
        "girder.concrete.unit_weight",
        ["missing"],
    ),
    Case("job-missing-strand-diameter.toml", "strand.diameter", ["missing"]),
    Case("job-missing-strand-area.toml", "strand.area", ["missing"]),
    Case(
        "job-missing-fpu.toml",
        "strand.fpu",
        ["missing"],
    ),
    Case(
        "job-missing-fpy.toml",
        "strand.fpy",
        ["missing"],
    ),
    Case("job-missing-strand-modulus.toml", "strand.modulus", ["missing"]),
    Case("job-missing-jacking-stress.toml", "strand.jacking_stress", ["missing"]),
    Case("job-missing-deck-thickness.toml", "deck.thickness", ["missing"]),
    Case("job-missing-deck-fc.toml", "deck.concrete.fc", ["missing"]),
    Case("job-missing-row-height.toml", "strands.rows[0].height", ["missing"]),
    Case("job-missing-row-count.toml", "strands.rows[1].count", ["missing"]),
    Case("job-missing-relative-humidity.toml", "time.relative_humidity", ["missing"]),
    Case("job-missing-transfer-age.toml", "time.transfer", ["missing"]),
    Case("job-missing-deck-placement-age.toml", "time.deck_placement", ["missing"]),
    Case("job-missing-final-age.toml", "time.final", ["missing"]),
    Case("job-missing-limits-file.toml", "limits", ["at least one of the stages"]),
    Case("job-missing-job-table.toml", "job", ["missing"]),
    Case("job-missing-girder-concrete-table.toml", "girder.concrete", ["missing"]),
    Case("job-missing-deck-concrete-table.toml", "deck.concrete", ["missing"]),
    Case(
        "job-missing-strand-table.toml",
        "strand",
        ["missing"],
    ),
    Case("job-missing-time-table.toml", "time", ["missing"]),
    Case("job-missing-strand-rows.toml", "strands.rows", ["[[strands.rows]]"]),
    Case(
        "job-missing-effective-width.toml",
        "deck.effective_width",
        ["an effective width", "girder.spacing"],
    ),
    Case("job-exterior-girder-without-overhang.toml", "deck.overhang", ["overhang", "exterior"]),
    Case("job-missing-live-moment.toml", "loads.live.moment_midspan", ["missing"]),
    Case(
        "job-missing-modulus-at-transfer.toml", "girder.concrete.modulus_at_transfer", ["missing"]
    ),
    Case("job-misspelt-key-spna.toml", "girder.spna", ["did you mean 'span'"]),
    Case(
        "job-misspelt-key-f_c.toml",
        "girder.concrete.f_c",
        ["did you mean 'fc'"],
    ),
    Case(
        "job-misspelt-key-unit-wieght.toml",
        "girder.concrete.unit_wieght",
        ["did you mean 'unit_weight'"],
    ),
    Case(
        "job-misspelt-key-modulus-unit-weigth.toml",
        "girder.concrete.modulus_unit_weigth",
        ["did you mean 'modulus_unit_weight'"],
    ),
    Case(
        "job-misspelt-key-jacking-stess.toml",
        "strand.jacking_stess",
        ["did you mean 'jacking_stress'"],
    ),
    Case("job-misspelt-key-relaxtion.toml", "strand.relaxtion", ["did you mean 'relaxation'"]),
    Case(
        "job-misspelt-key-effective-witdh.toml",
        "deck.effective_width",
        ["is 'effective_witdh' a misspelling"],
    ),
    Case(
        "job-misspelt-key-haunch-widht.toml", "deck.haunch_widht", ["did you mean 'haunch_width'"]
    ),
    Case("job-misspelt-key-spaceing.toml", "strands.rows[0].spaceing", ["did you mean 'spacing'"]),
    Case(
        "job-misspelt-key-transfer-lenght.toml",
        "strands.transfer_lenght",
        ["did you mean 'transfer_length'"],
    ),
    Case(
        "job-misspelt-key-superimposed-ded.toml",
        "loads.superimposed_ded",
        ["did you mean 'superimposed_dead'"],
    ),
    Case(
        "job-misspelt-key-moment-mid-span.toml",
        "loads.live.moment_mid_span",
        ["did you mean 'moment_midspan'"],
    ),
    Case(
        "job-misspelt-key-relative-humidty.toml",
        "time.relative_humidty",
        ["did you mean 'relative_humidity'"],
    ),
    Case(
        "job-misspelt-key-deck-placment.toml",
        "time.deck_placment",
        ["did you mean 'deck_placement'"],
    ),
    Case(
        "job-misspelt-key-section-library.toml",
        "job.section_library",
        ["did you mean 'section_libraries'"],
    ),
    Case("job-misspelt-key-enginer.toml", "job.enginer", ["did you mean 'engineer'"]),
    Case("job-misspelt-key-metod.toml", "losses.metod", ["did you mean 'method'"]),
    Case("job-misspelt-table-girdr.toml", "girdr", ["did you mean 'girder'"]),
    Case("job-misspelt-table-laods.toml", "laods", ["did you mean 'loads'"]),
    Case("job-deck-concrete-with-fci.toml", "deck.concrete.fci", ["did you mean 'fc'"]),
    Case("job-bare-number-fc.toml", "girder.concrete.fc", ["bare number"]),
    Case("job-bare-number-span.toml", "girder.span", ["bare number"]),
    Case("job-bare-number-unit-weight.toml", "girder.concrete.unit_weight", ["bare number"]),
    Case("job-bare-number-strand-area.toml", "strand.area", ["bare number"]),
    Case("job-bare-number-row-height.toml", "strands.rows[1].height", ["bare number"]),
    Case("job-bare-number-transfer-age.toml", "time.transfer", ["bare number"]),
    Case("job-bare-number-live-moment.toml", "loads.live.moment_midspan", ["bare number"]),
    Case("job-bare-number-haunch.toml", "deck.haunch", ["bare number"]),
    Case("job-no-unit-deck-thickness.toml", "deck.thickness", ["no unit"]),
    Case("job-no-unit-jacking-stress.toml", "strand.jacking_stress", ["no unit"]),
    Case("job-no-unit-length.toml", "girder.length", ["no unit"]),
    Case("job-no-unit-superimposed-dead.toml", "loads.superimposed_dead", ["no unit"]),
    Case("job-no-unit-final-age.toml", "time.final", ["no unit"]),
    Case("job-empty-string-fpu.toml", "strand.fpu", ["empty string"]),
    Case("job-malformed-quantity-fpu.toml", "strand.fpu", ["a stress with its unit"]),
    Case("job-wrong-dimension-length-ksi.toml", "girder.length", ["wrong dimension", "a length"]),
    Case("job-wrong-dimension-fc-in.toml", "girder.concrete.fc", ["wrong dimension", "a stress"]),
    Case("job-wrong-dimension-strand-area-in.toml", "strand.area", ["wrong dimension", "an area"]),
    Case(
        "job-wrong-dimension-strand-modulus-kip.toml",
        "strand.modulus",
        ["wrong dimension", "a stress"],
    ),
    Case(
        "job-wrong-dimension-line-load-kip.toml",
        "loads.superimposed_dead",
        ["wrong dimension", "a load per length"],
    ),
    Case(
        "job-wrong-dimension-moment-kip.toml",
        "loads.live.moment_midspan",
        ["wrong dimension", "a moment"],
    ),
    Case("job-wrong-dimension-final-age-ft.toml", "time.final", ["wrong dimension", "a time"]),
    Case(
        "job-wrong-dimension-unit-weight-ksi.toml",
        "girder.concrete.unit_weight",
        ["wrong dimension", "a unit weight"],
    ),
    Case(
        "job-wrong-dimension-humidity-ksi.toml",
        "time.relative_humidity",
        ["wrong dimension", "dimensionless"],
    ),
    Case(
        "job-wrong-dimension-effective-width-in2.toml",
        "deck.effective_width",
        ["wrong dimension", "a length"],
    ),
    Case("job-negative-deck-thickness.toml", "deck.thickness", ["positive"]),
    Case("job-zero-strand-area.toml", "strand.area", ["positive"]),
    Case("job-negative-span.toml", "girder.span", ["positive"]),
    Case("job-zero-length.toml", "girder.length", ["positive"]),
    Case("job-negative-row-height.toml", "strands.rows[1].height", ["positive"]),
    Case("job-zero-row-count.toml", "strands.rows[1].count", ["at least 1"]),
    Case("job-negative-row-count.toml", "strands.rows[0].count", ["at least 1"]),
    Case("job-zero-spacing.toml", "strands.rows[0].spacing", ["positive"]),
    Case("job-negative-superimposed-dead.toml", "loads.superimposed_dead", ["zero or more"]),
    Case("job-negative-haunch.toml", "deck.haunch", ["zero or more"]),
    Case("job-negative-live-moment.toml", "loads.live.moment_midspan", ["zero or more"]),
    Case("job-zero-strand-diameter.toml", "strand.diameter", ["positive"]),
    Case("job-zero-tributary-width.toml", "deck.tributary_width", ["positive"]),
    Case("job-negative-transfer-age.toml", "time.transfer", ["positive"]),
    Case("job-zero-transfer-age.toml", "time.transfer", ["positive"]),
    Case("job-negative-final-age.toml", "time.final", ["positive"]),
    Case("job-negative-fci.toml", "girder.concrete.fci", ["positive"]),
    Case("job-nan-row-height.toml", "strands.rows[0].height", ["finite"]),
    Case("job-inf-fc.toml", "girder.concrete.fc", ["finite"]),
    Case("job-nan-span.toml", "girder.span", ["finite"]),
    Case("job-inf-live-moment.toml", "loads.live.moment_midspan", ["finite"]),
    Case("job-minus-inf-strand-area.toml", "strand.area", ["finite"]),
    Case("job-nan-jacking-stress.toml", "strand.jacking_stress", ["finite"]),
    Case("job-toml-nan-humidity.toml", "time.relative_humidity", ["0 to 100"]),
    Case("job-toml-inf-humidity.toml", "time.relative_humidity", ["0 to 100"]),
    Case("job-toml-inf-load-factor.toml", "combinations.service_iii.live", ["finite"]),
    Case("job-toml-nan-k1.toml", "girder.concrete.K1", ["finite"]),
    Case("job-absurd-fc-7000-ksi.toml", "girder.concrete.fc", ["concrete strength"]),
    Case("job-absurd-deck-fc-4000-ksi.toml", "deck.concrete.fc", ["concrete strength"]),
    Case("job-absurd-unit-weight-150-kcf.toml", "girder.concrete.unit_weight", ["unit weight"]),
    Case("job-absurd-unit-weight-150-kn-m3.toml", "girder.concrete.unit_weight", ["unit weight"]),
    Case("job-absurd-modulus-4-ksi.toml", "girder.concrete.modulus", ["concrete modulus"]),
    Case(
        "job-absurd-modulus-at-transfer-4-ksi.toml",
        "girder.concrete.modulus_at_transfer",
        ["concrete modulus"],
    ),
    Case("job-absurd-strand-modulus-28500-psi.toml", "strand.modulus", ["strand modulus"]),
    Case(
        "job-absurd-span-80-in.toml",
        "girder.span",
        ["span"],
    ),
    Case("job-absurd-length-820-ft.toml", "girder.length", ["100 m"]),
    Case(
        "job-absurd-fpu-2700-ksi.toml",
        "strand.fpu",
        ["fpu"],
    ),
    Case(
        "job-absurd-strand-area-ft2.toml",
        "strand.area",
        ["area"],
    ),
    Case(
        "job-absurd-strand-diameter-0.6-ft.toml",
        "strand.diameter",
        ["diameter"],
    ),
    Case(
        "job-transfer-length-longer-than-half-girder.toml",
        "strands.transfer_length",
        ["transfer length"],
    ),
    Case(
        "job-modulus-unit-weight-outside-formula-range.toml",
        "girder.concrete.modulus_unit_weight",
        ["155 pcf"],
    ),
    Case("job-k1-out-of-range.toml", "girder.concrete.K1", ["0.1 to 2"]),
    Case("job-load-factor-out-of-range.toml", "combinations.service_iii.live", ["0 to 5"]),
    Case("job-strand-row-too-wide.toml", "strands.rows[0]", ["outside"]),
    Case("job-strand-row-above-girder.toml", "strands.rows[1]", ["outside"]),
    Case("job-strand-row-too-wide-for-web.toml", "strands.rows[1]", ["outside"]),
    Case("job-strand-row-without-cover.toml", "strands.rows[0]", ["outside"]),
    Case("job-ages-deck-before-transfer.toml", "time.deck_placement", ["later than transfer"]),
    Case("job-ages-final-before-deck.toml", "time.final", ["later than deck placement"]),
    Case("job-ages-deck-equal-transfer.toml", "time.deck_placement", ["later than transfer"]),
    Case("job-humidity-above-100.toml", "time.relative_humidity", ["0 to 100"]),
    Case("job-humidity-as-fraction.toml", "time.relative_humidity", ["a fraction?", "70 %"]),
    Case("job-fci-psi-as-ksi.toml", "girder.concrete.fci", ["from 1.5 to 29 ksi", "5.5e+03 ksi"]),
    Case("job-humidity-negative.toml", "time.relative_humidity", ["0 to 100"]),
    Case("job-humidity-string-above-100.toml", "time.relative_humidity", ["0 to 100"]),
    Case("job-humidity-boolean.toml", "time.relative_humidity", ["boolean"]),
    Case("job-fci-above-fc.toml", "girder.concrete.fci", ["no greater than f'c"]),
    Case("job-fci-too-low.toml", "girder.concrete.fci", ["from 1.5 to 29 ksi (10 to 200 MPa)"]),
    Case("job-fpy-above-fpu.toml", "strand.fpy", ["less than fpu"]),
    Case("job-fpy-equal-fpu.toml", "strand.fpy", ["less than fpu"]),
    Case("job-jacking-above-075-fpu.toml", "strand.jacking_stress", ["0.75 fpu"]),
    Case("job-jacking-stress-relieved-above-070-fpu.toml", "strand.jacking_stress", ["0.70 fpu"]),
    Case(
        "job-stress-before-transfer-above-jacking.toml",
        "strand.stress_before_transfer",
        ["no more than the jacking stress"],
    ),
    Case("job-unknown-relaxation.toml", "strand.relaxation", ["one of", "'low'"]),
    Case("job-unknown-output-units.toml", "job.units", ["one of"]),
    Case("job-unknown-modulus-formula.toml", "girder.concrete.modulus", ["'aashto'"]),
    Case("job-unknown-loss-method.toml", "losses.method", ["one of"]),
    Case("job-wrong-type-title-table.toml", "job.title", ["a string"]),
    Case("job-wrong-type-units-list.toml", "job.units", ["a string"]),
    Case("job-wrong-type-girder-concrete-list.toml", "girder.concrete", ["a table", "list"]),
    Case("job-wrong-type-section-libraries-string.toml", "job.section_libraries", ["a list"]),
    Case("job-wrong-type-strand-rows-table.toml", "strands.rows", ["an array of tables"]),
    Case("job-wrong-type-count-float.toml", "strands.rows[0].count", ["a whole number"]),
    Case("job-wrong-type-count-string.toml", "strands.rows[0].count", ["a whole number"]),
    Case(
        "job-wrong-type-haunch-in-stiffness-string.toml",
        "deck.haunch_in_stiffness",
        ["true or false"],
    ),
    Case("job-wrong-type-modulus-number.toml", "girder.concrete.modulus", ["or a stress"]),
    Case("job-wrong-type-load-factor-string.toml", "combinations.service_iii.live", ["a number"]),
    Case("job-wrong-type-k1-string.toml", "girder.concrete.K1", ["a number"]),
    Case("job-wrong-type-fc-table.toml", "girder.concrete.fc", ["a table"]),
    Case("job-wrong-type-span-list.toml", "girder.span", ["a list"]),
    Case("job-wrong-type-spacing-list.toml", "strands.rows[0].spacing", ["a list"]),
    Case("job-live-moments-ten-values.toml", "loads.live.moments", ["a list of 11 moments"]),
    Case("job-live-moments-bare-numbers.toml", "loads.live.moments[0]", ["bare number"]),
    Case(
        "job-live-moment-both-forms.toml",
        "loads.live.moment_midspan",
        ["either"],
    ),
    Case("job-span-longer-than-length.toml", "girder.span", ["no longer than the girder length"]),
    Case(
        "job-mixed-fraction-deck-thickness.toml",
        "deck.thickness",
        ["7 1/2 in"],
    ),
    Case("job-feet-and-inches-without-operator.toml", "girder.span", ["one number, then its unit"]),
    # a hyphen is a product only between two unit words ("kip-ft"), never a sum of lengths
    Case("job-feet-hyphen-inches-span.toml", "girder.span", ["one number, then its unit"]),
    # "mPa" is pint's millipascal and keeps that meaning (no guess that MPa was meant)
    Case("job-fc-millipascal.toml", "girder.concrete.fc", ["concrete strength"]),
    Case("job-unknown-girder-position.toml", "girder.position", ["one of", "'exterior'"]),
    Case("job-bare-number-girder-spacing.toml", "girder.spacing", ["bare number"]),
    Case("job-unknown-loss-section.toml", "losses.section", ["one of", "'transformed'"]),
    Case("job-refined-losses-without-deck.toml", "losses.method", ["a [deck] table"]),
    Case("job-unknown-section-name.toml", "girder.section", ["did you mean"]),
    # a name with spaces is not taken for a path: the library name ending with it is suggested
    Case(
        "job-section-name-with-spaces.toml",
        "girder.section",
        ["did you mean 'AASHTO-Type-IV'?", "'Type IV'"],
    ),
    Case("job-section-name-is-path.toml", "girder.section", ["not a path"]),
    Case("job-section-name-absolute-path.toml", "girder.section", ["not a path"]),
    Case("job-section-name-toml-file.toml", "girder.section", ["not a path"]),
    Case("job-section-as-number.toml", "girder.section", ["a section name"]),
    Case("job-section-library-folder-missing.toml", "job.section_libraries[0]", ["folder"]),
    Case(
        "job-inline-section-flange-narrower-than-web.toml",
        "girder.section.dimensions.top_flange_width",
        ["at least as wide as the web"],
    ),
    Case(
        "job-inline-section-unknown-family.toml",
        "girder.section.family",
        ["did you mean 'i_girder'"],
    ),
    Case(
        "job-inline-section-unknown-dimension.toml",
        "girder.section.dimensions.web_thickness",
        ["did you mean"],
    ),
    Case("job-inline-section-missing-family.toml", "girder.section.family", ["missing"]),
    Case(
        "job-inline-section-negative-depth.toml",
        "girder.section.dimensions.depth",
        ["positive length"],
    ),
    Case(
        "job-inline-section-tapers-too-long.toml",
        "girder.section.dimensions.top_tapers",
        ["flange overhang"],
    ),
    Case(
        "job-inline-section-depth-too-small.toml",
        "girder.section.dimensions.depth",
        ["sum of both flange thicknesses"],
    ),
    Case(
        "job-inline-section-bare-number-dimension.toml",
        "girder.section.dimensions.web_width",
        ["bare number"],
    ),
    Case(
        "job-inline-section-missing-dimension.toml",
        "girder.section.dimensions.web_width",
        ["required"],
    ),
    Case(
        "job-inline-section-taper-single-value.toml",
        "girder.section.dimensions.bottom_tapers[0]",
        ["pairs"],
    ),
    Case(
        "job-inline-section-name-is-path-like-family.toml",
        "girder.section.family",
        ["a section family"],
    ),
    Case("job-limits-inline-compression-1.5.toml", "limits.transfer.compression", ["0 to 1"]),
    Case("job-limits-inline-unknown-stage.toml", "limits.servce_i", ["did you mean 'service_i'"]),
    Case(
        "job-limits-inline-tension-coefficient-string.toml",
        "limits.transfer.tension.coefficient",
        ["a number"],
    ),
    Case("job-limits-file-missing.toml", "limits.file", ["no file"]),
    Case("job-limits-file-is-folder.toml", "limits.file", ["not a file"]),
    Case("job-limits-file-not-a-string.toml", "limits.file", ["a string"]),
    Case("job-limits-file-and-inline-stage.toml", "limits.transfer", ["known key"]),
    Case("job-truncated-toml.toml", None, ["valid TOML", "end of document"]),
    Case("job-non-utf8-bytes.toml", None, ["UTF-8", "offset 515"]),
    Case("job-empty-file.toml", None, ["empty file"]),
    Case("job-only-comments.toml", "job", ["missing"]),
    Case("job-only-whitespace.toml", None, ["empty file"]),
    Case("job-duplicate-key.toml", None, ["valid TOML", "line 18"]),
    Case("job-unclosed-table-header.toml", None, ["valid TOML", "line 14"]),
    Case("job-unterminated-string.toml", None, ["valid TOML", "line 21"]),
    Case("job-unquoted-quantity.toml", None, ["valid TOML", "line 1"]),
    Case("job-byte-order-mark.toml", None, ["valid TOML", "line 1, column 1"]),
    Case("job-duplicate-table.toml", None, ["valid TOML", "line 35"]),
    Case(
        "limits/limits-compression-fraction-1.5.toml",
        "transfer.compression",
        ["0 to 1"],
        run="limits",
    ),
    Case(
        "limits/limits-negative-compression.toml",
        "service_permanent.compression",
        ["0 to 1"],
        run="limits",
    ),
    Case(
        "limits/limits-compression-as-percent.toml",
        "service_i.compression",
        ["0 to 1"],
        run="limits",
    ),
    Case(
        "limits/limits-compression-as-string.toml",
        "transfer.compression",
        ["a number"],
        run="limits",
    ),
    Case(
        "limits/limits-unknown-stage-name.toml",
        "service_1",
        ["did you mean 'service_i'"],
        run="limits",
    ),
    Case(
        "limits/limits-unknown-fiber-name.toml",
        "service_iii.girder_botom",
        ["did you mean 'girder_bottom'"],
        run="limits",
    ),
    Case(
        "limits/limits-misspelt-compression.toml",
        "service_permanent.compresion",
        ["did you mean 'compression'"],
        run="limits",
    ),
    Case(
        "limits/limits-tension-coefficient-as-string.toml",
        "transfer.tension.coefficient",
        ["a number"],
        run="limits",
    ),
    Case(
        "limits/limits-tension-negative-coefficient.toml",
        "service_iii.girder_bottom.tension.coefficient",
        ["0 to 100"],
        run="limits",
    ),
    Case(
        "limits/limits-tension-without-root-unit.toml",
        "transfer.tension.root_unit",
        ["missing"],
        run="limits",
    ),
    Case(
        "limits/limits-tension-unknown-root-unit.toml",
        "transfer.tension.root_unit",
        ["one of"],
        run="limits",
    ),
    Case("limits/limits-tension-as-number.toml", "transfer.tension", ["a table"], run="limits"),
    Case(
        "limits/limits-tension-cap-bare-number.toml",
        "service_iii.girder_bottom.tension.cap",
        ["bare number"],
        run="limits",
    ),
    Case(
        "limits/limits-tension-cap-wrong-dimension.toml",
        "service_iii.girder_bottom.tension.cap",
        ["wrong dimension"],
        run="limits",
    ),
    Case("limits/limits-stage-as-array-of-tables.toml", "transfer", ["a table"], run="limits"),
    Case("limits/limits-name-as-list.toml", "name", ["a string"], run="limits"),
    Case(
        "limits/limits-no-stages.toml",
        None,
        ["at least one of the stages", "transfer"],
        run="limits",
    ),
    Case("limits/limits-truncated.toml", None, ["valid TOML", "end of document"], run="limits"),
    Case(
        "lib-duplicate-section-names/sections",
        "section[0].name",
        ["unique", "a-girders.toml"],
        run="sections",
        file="lib-duplicate-section-names/sections/b-girders.toml",
    ),
    Case(
        "lib-duplicate-section-names-same-file/sections",
        "section[1].name",
        ["unique"],
        run="sections",
        file="lib-duplicate-section-names-same-file/sections/girders.toml",
    ),
    Case(
        "lib-duplicate-section-names-via-job/job.toml",
        "section[0].name",
        ["unique"],
        file="lib-duplicate-section-names-via-job/sections/b-girders.toml",
    ),
    Case(
        "lib-missing-family/sections",
        "section[0].family",
        ["missing"],
        run="sections",
        file="lib-missing-family/sections/girders.toml",
    ),
    Case(
        "lib-unknown-family/job.toml",
        "section[0].family",
        ["did you mean 'bulb_tee'"],
        file="lib-unknown-family/sections/girders.toml",
    ),
    Case(
        "lib-section-name-with-slash/sections",
        "section[0].name",
        ["not a path"],
        run="sections",
        file="lib-section-name-with-slash/sections/girders.toml",
    ),
    Case(
        "lib-dimensions-not-table/sections",
        "section[0].dimensions",
        ["a table of dimensions"],
        run="sections",
        file="lib-dimensions-not-table/sections/girders.toml",
    ),
    Case(
        "lib-misspelt-dimension/job.toml",
        "section[0].dimensions.web_widht",
        ["did you mean 'web_width'"],
        file="lib-misspelt-dimension/sections/girders.toml",
    ),
    Case(
        "lib-misspelt-key-descripton/sections",
        "section[0].descripton",
        ["did you mean 'description'"],
        run="sections",
        file="lib-misspelt-key-descripton/sections/girders.toml",
    ),
    Case(
        "lib-section-not-array/sections",
        "section",
        ["an array of tables"],
        run="sections",
        file="lib-section-not-array/sections/girders.toml",
    ),
    Case(
        "lib-self-intersecting-polygon/job.toml",
        "section[0].dimensions.outline",
        ["Self-intersection"],
        file="lib-self-intersecting-polygon/sections/girders.toml",
    ),
    Case(
        "lib-hole-outside-outline/job.toml",
        "section[0].dimensions.holes[0]",
        ["inside the outline"],
        file="lib-hole-outside-outline/sections/girders.toml",
    ),
    # the same two library folders listed directly (the listing builds every shape)
    Case(
        "lib-self-intersecting-polygon/sections",
        "section[0].dimensions.outline",
        ["Self-intersection"],
        run="sections",
        file="lib-self-intersecting-polygon/sections/girders.toml",
    ),
    Case(
        "lib-hole-outside-outline/sections",
        "section[0].dimensions.holes[0]",
        ["inside the outline"],
        run="sections",
        file="lib-hole-outside-outline/sections/girders.toml",
    ),
    Case(
        "lib-overlapping-holes/job.toml",
        "section[0].dimensions.holes[1]",
        ["overlap"],
        file="lib-overlapping-holes/sections/girders.toml",
    ),
    Case(
        "lib-polygon-two-points/job.toml",
        "section[0].dimensions.outline",
        ["at least 3 points"],
        file="lib-polygon-two-points/sections/girders.toml",
    ),
    Case(
        "lib-polygon-unknown-unit/job.toml",
        "section[0].dimensions.unit",
        ["length unit"],
        file="lib-polygon-unknown-unit/sections/girders.toml",
    ),
    Case(
        "lib-truncated/sections",
        None,
        ["valid TOML", "end of document"],
        run="sections",
        file="lib-truncated/sections/girders.toml",
    ),
    Case(
        "lib-non-utf8/sections",
        None,
        ["UTF-8", "offset 337"],
        run="sections",
        file="lib-non-utf8/sections/girders.toml",
    ),
]


def _argv(case: Case, tmp_path: Path) -> tuple[list[str], str]:
    """The command line of a case and the path of the file its message must name."""
    target = CORPUS / case.path
    if case.run == "sections":
        argv = ["sections", "--library", str(target)]
    elif case.run == "limits":
        ref = 'file = "limits/aashto-lrfd-9th-service.toml"'
        text = BASE_JOB.read_text(encoding="utf-8")
        assert ref in text
        job = tmp_path / f"job-using-{target.stem}.toml"
        job.write_text(text.replace(ref, f'file = "{target.as_posix()}"'), encoding="utf-8")
        argv = ["check", str(job)]
    else:
        argv = ["check", str(target)]
    return argv, str(CORPUS / (case.file or case.path))


def _params() -> list:
    return [
        pytest.param(
            c,
            id=c.path,
            marks=[pytest.mark.xfail(strict=True, reason=c.bug)] if c.bug else [],
        )
        for c in CASES
    ]


def _check_message(code: int, out: str, err: str, case: Case, file: str) -> None:
    assert "Traceback" not in out + err
    assert code == 2, (code, err)
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    line = lines[0]
    assert line.startswith("prestress: error: "), line
    assert file in line, (file, line)
    if case.field is not None:
        assert f"field '{case.field}'" in line, (case.field, line)
    rest = line.replace(file, "")  # the words must not come from the file's name
    for w in case.words:
        assert w in rest, (w, line)


@pytest.fixture(scope="module")
def drivers(tmp_path_factory: pytest.TempPathFactory) -> Path:
    """A folder for the jobs that run the limit-set cases."""
    return tmp_path_factory.mktemp("corpus-drivers")


@pytest.mark.parametrize("case", _params())
def test_corpus_case(case: Case, drivers: Path, capsys: pytest.CaptureFixture[str]) -> None:
    argv, file = _argv(case, drivers)
    code = main(argv)
    captured = capsys.readouterr()
    _check_message(code, captured.out, captured.err, case, file)


#: A few cases run through a real ``python -m prestress`` process.
SUBPROCESS_CASES = (
    "job-bare-number-fc.toml",
    "job-non-utf8-bytes.toml",
    "job-strand-row-too-wide.toml",
    "lib-self-intersecting-polygon/job.toml",
    "limits/limits-tension-without-root-unit.toml",
)


@pytest.mark.parametrize("path", SUBPROCESS_CASES)
def test_corpus_case_in_a_real_process(path: str, tmp_path: Path) -> None:
    (case,) = [c for c in CASES if c.path == path]
    argv, file = _argv(case, tmp_path)
    env = dict(os.environ)
    env["PYTHONPATH"] = os.pathsep.join(p for p in (str(ROOT), env.get("PYTHONPATH", "")) if p)
    proc = subprocess.run(
        [sys.executable, "-m", "prestress", *argv],
        capture_output=True,
        text=True,
        cwd=ROOT,
        env=env,
        timeout=120,
    )
    _check_message(proc.returncode, proc.stdout, proc.stderr, case, file)


def test_every_corpus_file_is_in_the_table() -> None:
    """The directory listing and the table agree: no untested corpus file, no stale entry."""
    paths = [c.path for c in CASES]
    assert len(paths) == len(set(paths)), "a case is listed twice"
    assert len(CASES) >= 110
    on_disk: set[str] = set()
    for p in sorted(CORPUS.rglob("*")):
        if p.is_dir():
            continue
        rel = p.relative_to(CORPUS).as_posix()
        if rel in SUPPORT:
            continue
        top = rel.split("/")[0]
        on_disk.add(rel if top == "limits" else top)
    listed = {c.unit for c in CASES}
    assert on_disk - listed == set(), "corpus entries without a case in the table"
    assert listed - on_disk == set(), "cases whose corpus entry does not exist"
    for c in CASES:  # the file a message must name exists
        assert (CORPUS / (c.file or c.path)).exists(), c


def test_the_base_of_the_corpus_is_valid(capsys: pytest.CaptureFixture[str]) -> None:
    """Each job case is the valid base plus one mistake: the base itself must check (0 or 1)."""
    assert BASE_LIMITS.is_file()
    assert main(["check", str(BASE_JOB), "--json", "-"]) in (0, 1)
    assert capsys.readouterr().err == ""
