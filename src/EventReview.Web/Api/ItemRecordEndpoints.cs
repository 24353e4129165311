using System.Security.Claims;
using EventReview.Web.Auth;
using EventReview.Web.Services;

namespace EventReview.Web.Api;

/// <summary>Read endpoints for what the dossier holds of an item beyond its evidence: computation records and sign-offs.</summary>
public static class ItemRecordEndpoints
{
    public static void Map(RouteGroupBuilder api)
    {
        api.MapGet("/cases/{id:int}/items/{key}/computations", (int id, string key, ClaimsPrincipal user, CaseQueries cases, int? offset, int? limit) => ApiResults.Guard(async () =>
        {
            var page = await cases.ComputationPageAsync(user, id, key, offset, limit);
            return Results.Ok(new CaseDtos.Page<RecordDtos.Computation>(page.Total, page.Offset, page.Limit,
                page.Records.Select(r => RecordDtos.Of(r, page.CurrentIds.Contains(r.Id))).ToList()));
        })).RequireAuthorization(Policies.Read)
          .WithDescription("One page of an item's computation records (verdict, summary with units, parameters, result numbers, pictures as SVG), oldest first; 'current' marks the newest of each kind.")
          .Produces<CaseDtos.Page<RecordDtos.Computation>>().Documented("listComputations", "List an item's computation records", CaseEndpoints.Tags.Records, false, 400, 404, 422);

        api.MapGet("/cases/{id:int}/items/{key}/signoffs", (int id, string key, ClaimsPrincipal user, CaseQueries cases) => ApiResults.Guard(async () =>
        {
            var overview = await cases.GetOverviewAsync(user, id);
            var item = overview.Case.Items.FirstOrDefault(i => i.Key == key)
                ?? throw new KeyNotFoundException($"Case {id} has no checklist item '{key}'.");
            return Results.Ok(new RecordDtos.ItemSignOffs(item.Key, CaseDtos.Api(item.State), overview.Items[item.Key].Fingerprint, item.RequiredSignOffs,
                item.CurrentSignOffs.Count(), item.SignOffs.OrderBy(s => s.SignedAtUtc).ThenBy(s => s.Id).Select(RecordDtos.Of).ToList()));
        })).RequireAuthorization(Policies.Read)
          .WithDescription("An item's sign-offs, stale ones too, with the evidence fingerprint each was bound to and the item's current fingerprint.")
          .Produces<RecordDtos.ItemSignOffs>().Documented("listSignOffs", "List an item's sign-offs", CaseEndpoints.Tags.Records, false, 400, 404);
    }
}
