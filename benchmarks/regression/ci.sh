#!/bin/sh
# The CI step of the worked example (benchmarks/regression/README.md), run from the repository root.
# Each line exits non-zero, failing the build, when a committed certificate no longer audits, or its
# plan is no longer valid or no longer optimal for the model as it is now. PLUMBLINE names the CLI.
set -e
PLUMBLINE=${PLUMBLINE:-"npx plumbline"}
$PLUMBLINE audit benchmarks/regression --jobs 2 --time-limit-per-certificate 300 --junit plumbline-audit.xml
$PLUMBLINE rejudge benchmarks/regression/harbour-02/certificate --domain benchmarks/regression/harbour-02/model/domain.pddl --problem benchmarks/regression/harbour-02/model/problem.pddl --time-limit 300
