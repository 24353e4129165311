namespace EventReview.Core.Records;

/// <summary>The row part of <see cref="CaseRecordCheck"/>: evidence, computation and sign-off rows, and frozen configuration records.</summary>
internal static class RowCheck
{
    public static void Compare(RecordedCase recorded, StoredCase stored, Action<int?, string?, string> add)
    {
        var unmatched = stored.Rows.ToList();
        foreach (var r in recorded.Rows.Where(r => r.Part != "configuration"))
        {
            var i = unmatched.FindIndex(s => s.Part == r.Part && s.Item == r.Item && s.Seal == r.Seal);
            if (i < 0)
            {
                add(r.Entry, r.Item, $"The {What(r)} recorded in entry {r.Entry} ({r.ActorName}, {CaseRecordCheck.Ticks(r.AtUtcTicks)}) is missing from the database.");
                continue;
            }

            var s = unmatched[i];
            unmatched.RemoveAt(i);
            if (r.Part == "evidence" && s.Detail != r.Detail)
            {
                add(r.Entry, r.Item, $"The {s.Label}: its text or content type was changed after entry {r.Entry} recorded it.");
            }

            if (r.Part != "signoff")
            {
                continue;
            }

            switch (r.Stale, s.Stale)
            {
                case (null, false) when s.StaleSinceUtcTicks is not null:
                    add(null, r.Item, $"The {s.Label} is current, but the database gives it a stale time ({CaseRecordCheck.Ticks(s.StaleSinceUtcTicks.Value)}) that no signed entry records.");
                    break;
                case (null, true):
                    add(null, r.Item, $"The {s.Label} is marked stale in the database, but the signed record has no stale mark for it.");
                    break;
                case ({ } mark, false):
                    add(mark.Entry, r.Item, $"The {s.Label} was made stale in entry {mark.Entry}, but the database shows it current.");
                    break;
                case ({ } mark, true) when s.StaleSinceUtcTicks != mark.SinceUtcTicks:
                    add(mark.Entry, r.Item, $"The {s.Label} is stale since {CaseRecordCheck.Ticks(s.StaleSinceUtcTicks ?? 0)} in the database, but entry {mark.Entry} made it stale at {CaseRecordCheck.Ticks(mark.SinceUtcTicks)}.");
                    break;
            }
        }

        foreach (var s in unmatched)
        {
            var how = s.Part switch
            {
                "signoff" => "inserted, or its signer, time, statement, meaning or fingerprint altered",
                "computation" => "inserted, or its result, verdict, summary, pictures, runner or time altered",
                _ => "inserted, or altered after it was recorded",
            };
            add(null, s.Item, $"The {s.Label} is in the database, but no signed entry accounts for it ({how}).");
        }
    }

    public static void CompareConfigurations(RecordedCase recorded, IReadOnlyList<StoredConfiguration> stored, Action<int?, string?, string> add)
    {
        var frozen = recorded.Rows.Where(r => r.Part == "configuration").ToList();
        foreach (var r in frozen)
        {
            var parts = r.Detail.Split(' ');
            var (fingerprint, detail) = (parts[0], parts.Length > 1 ? parts[1] : string.Empty);
            var s = stored.FirstOrDefault(x => x.Id == r.Seal);
            var name = $"configuration record {r.Seal}" + (s is null ? string.Empty : $" of {s.SiteCode}");
            if (s is null)
            {
                add(r.Entry, null, $"The {name}, frozen in entry {r.Entry}, is missing from the database.");
            }
            else if (!s.IsFrozen)
            {
                add(r.Entry, null, $"The {name}, frozen in entry {r.Entry}, is no longer marked frozen in the database.");
            }
            else if (s.Recomputed != fingerprint)
            {
                add(r.Entry, null, $"The frozen {name} was altered after entry {r.Entry} froze it: its items, label, period or reason now give fingerprint {Short(s.Recomputed)}, not {Short(fingerprint)}.");
            }
            else if (s.Fingerprint != fingerprint)
            {
                add(r.Entry, null, $"The stored fingerprint of the frozen {name} was changed: the database says {Short(s.Fingerprint)} but entry {r.Entry} froze it as {Short(fingerprint)}.");
            }
            else if (s.Detail != detail)
            {
                add(r.Entry, null, $"The frozen {name}: who captured or froze it, or when, was changed after entry {r.Entry} froze it.");
            }
        }

        foreach (var s in stored.Where(s => s.IsFrozen && frozen.All(r => r.Seal != s.Id)))
        {
            add(null, null, $"The configuration record {s.Id} of {s.SiteCode} is marked frozen for this case, but no signed entry records the freeze.");
        }
    }

    private static string What(RecordedRow r) => (r.Part, r.EntryKind) switch
    {
        ("evidence", "evidence.attachment") => "file",
        ("evidence", "evidence.link") => "link",
        ("evidence", _) => "note",
        ("computation", _) => $"'{r.EntryKind.Replace("computation.", string.Empty, StringComparison.Ordinal)}' computation record",
        _ => "sign-off",
    };

    private static string Short(string? hash) => hash is null ? "(none)" : hash.Length > 12 ? hash[..12] + "…" : hash;
}
