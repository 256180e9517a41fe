"""The ``influence`` command: thin wrappers that parse, call one library function and format.

Our own errors print as one line and exit with status 1; usage errors exit with status 2 (click);
``--debug`` shows the traceback instead.
"""

from __future__ import annotations

import sys

import click

from vehicles.errors import ToolError


class _OneLineErrors(click.Group):
    """Turns our errors into one line on stderr and exit status 1."""

    def invoke(self, ctx: click.Context) -> object:
        try:
            return super().invoke(ctx)
        except ToolError as error:
            if ctx.obj and ctx.obj.get("debug"):
                raise
            click.echo(f"error: {error}", err=True)
            sys.exit(1)
        except MemoryError:
            if ctx.obj and ctx.obj.get("debug"):
                raise
            click.echo("error: the request is too large for this machine's memory (ask for "
                       "fewer sections, positions or rows)", err=True)
            sys.exit(1)


@click.group(cls=_OneLineErrors)
@click.option("--debug", is_flag=True, help="Show the full traceback on errors.")
@click.version_option(package_name="influence-lines")
@click.pass_context
def main(ctx: click.Context, debug: bool) -> None:
    """Exact influence lines, governing load positions and envelopes for moving load trains."""
    ctx.ensure_object(dict)
    ctx.obj["debug"] = debug


def _register() -> None:
    # each command lives in its own module; importing them here keeps this file the only wiring
    from influence.cli import commands  # noqa: F401


_register()
