namespace EventReview.Web.Services.Checks;

/// <summary>
/// The two components of one check kind, registered in dependency injection (<see cref="CheckViewRegistration.AddCheckView"/>):
/// its run form (gets Case, Item, User and OnChanged) and the view of a stored record's result (gets Record).
/// </summary>
/// <param name="Kind">The check kind (<see cref="Core.Checklists.CheckKind"/>).</param>
/// <param name="Runner">The run form component.</param>
/// <param name="ResultView">The result view component.</param>
public sealed record CheckView(string Kind, Type Runner, Type ResultView);
