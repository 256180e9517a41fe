"""One task of a batch: one structure under one run, computed on a worker.

The model file is read and factorised once; the run's load models are loaded in the structure's
units; the kind's adapter makes the rows. Whatever goes wrong in the structure's own data or
computation is contained here: the task returns one ``error`` row with a one-line message, so a
bad structure never stops the others (losing the worker itself is the engine's to retry).

Example (a structure whose model file is missing):
    >>> from influence.batch.envelope_kind import EnvelopeSettings
    >>> from influence.batch.inventory import Structure
    >>> from influence.batch.job import Run
    >>> from influence.batch.kinds import KINDS
    >>> run = Run("legal", KINDS["envelope"], ("Type 3",), settings=EnvelopeSettings())
    >>> [row] = run_task(Structure("B-9", "/no/such/b9.toml"), run)
    >>> row.status, row.message
    ('error', '/no/such/b9.toml: file not found (check the path)')
"""

from __future__ import annotations

from influence.analysis.lines import analyse_model
from influence.batch.inventory import Structure
from influence.batch.job import Run
from influence.batch.rows import ResultRow, Subject, error_row, stamped
from influence.design.loading import vehicles_for
from influence.errors import BatchError, InfluenceError
from influence.model.reader import read_model_file
from vehicles.errors import VehicleError
from vehicles.loadmodel import LoadModel


def run_task(structure: Structure, run: Run) -> tuple[ResultRow, ...]:
    """The rows of one structure under one run; one ``error`` row if it cannot be computed."""
    kind = run.kind.name
    try:
        model_file = read_model_file(structure.model_path)
        basis = model_file.basis
        names = run.vehicles or basis.live.vehicles
        models: list[LoadModel] = []
        notes: list[str] = []
        if run.kind.loads_vehicles:
            if not names:
                raise BatchError("no vehicles", source=model_file.source, item=run.name,
                                 fix="give vehicles in the job's run or live_load.vehicles in "
                                     "the model file")
            models, notes = vehicles_for(names, model_file.model.units,
                                         {**basis.live.adjust, **dict(run.adjust)})
        subject = Subject(structure, model_file, analyse_model(model_file.model),
                          tuple(models), tuple(notes), tuple(run.vehicles))
        rows = run.kind.run(run.settings, subject)
    except (InfluenceError, VehicleError) as error:
        return (error_row(structure, run.name, kind, str(error)),)
    except Exception as error:  # noqa: BLE001 -- any fault of one structure stays its own
        return (error_row(structure, run.name, kind, one_line(error)),)
    return tuple(stamped(row, structure, run.name, kind, subject.units) for row in rows)


def one_line(error: BaseException) -> str:
    """An unexpected error as one line: its type and the first line of its message.

    Example:
        >>> one_line(ZeroDivisionError("division by zero\\nmore"))
        'unexpected ZeroDivisionError: division by zero'
    """
    text = str(error).strip().splitlines()
    return f"unexpected {type(error).__name__}" + (f": {text[0]}" if text else "")
