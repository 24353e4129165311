using System.Data.Common;

namespace EventReview.Data.Writes;

/// <summary>Running a batch's units: one after the other (SQLite), or sharing round trips to PostgreSQL (<see cref="RoundTripPipe"/>).</summary>
public sealed partial class BatchingWriteGate
{
    /// <summary>
    /// Runs the units of a PostgreSQL batch sharing round trips (<see cref="RoundTripPipe"/>): each unit in order until it
    /// waits for the round trip or ends; then one round trip for all; then each waiting unit continues, in order, and so
    /// on until every unit has ended.
    /// </summary>
    private async Task RunSharingRoundTripsAsync(List<PendingUnit> batch, DbConnection connection, DbTransaction tx, List<PendingUnit> saved, List<PendingUnit> retry)
    {
        var pipe = _pipe!;
        pipe.BeginBatch();
        var waiting = new List<(PendingUnit Unit, Task Run)>();
        foreach (var unit in batch)
        {
            pipe.Arm();
            var run = unit.ExecuteAsync(connection, tx);
            if (await pipe.WaitAsync(run))
            {
                waiting.Add((unit, run));
            }
            else
            {
                await Settle(unit, run, saved, retry);
            }
        }

        while (waiting.Count > 0)
        {
            var entries = await pipe.FlushAsync(connection, tx);
            if (entries.Count != waiting.Count)
            {
                throw new InvalidOperationException($"{waiting.Count} units wait for the round trip but {entries.Count} sent statements.");
            }

            var next = new List<(PendingUnit Unit, Task Run)>();
            for (var i = 0; i < waiting.Count; i++)
            {
                pipe.Arm();
                RoundTripPipe.Release(entries[i]);
                if (await pipe.WaitAsync(waiting[i].Run))
                {
                    next.Add(waiting[i]);
                }
                else
                {
                    await Settle(waiting[i].Unit, waiting[i].Run, saved, retry);
                }
            }

            waiting = next;
        }
    }

    /// <summary>Waits for a unit's run to end and sorts it: saved, to run again in the next batch, or failed.</summary>
    private static async Task Settle(PendingUnit unit, Task run, List<PendingUnit> saved, List<PendingUnit> retry)
    {
        try
        {
            await run;
            saved.Add(unit);
        }
        catch (BatchAbortException)
        {
            throw;
        }
        catch (Exception ex) when (IsLockConflict(ex) && unit.CanRetry && ++unit.Attempts < MaxAttempts)
        {
            // PostgreSQL chose this unit to break a lock cycle with another instance's batch; its savepoint is
            // rolled back and it runs again in the next batch, after this one's commit released its locks.
            retry.Add(unit);
        }
        catch (Exception ex)
        {
            unit.Fail(ex);
        }
    }
}
