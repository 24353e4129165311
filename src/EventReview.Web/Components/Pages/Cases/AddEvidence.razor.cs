using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence.Roles;
using EventReview.Web.Services;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Forms;

namespace EventReview.Web.Components.Pages.Cases;

/// <summary>State of the add-evidence forms; every change goes through <see cref="EvidenceAppender"/> and is reported to the item panel.</summary>
public partial class AddEvidence
{
    private const string NoSite = "";

    private string? _note;
    private int _noteTab;
    private string? _linkUrl;
    private string? _linkTitle;
    private string? _fileDescription;
    private IBrowserFile? _file;
    private FileRoleGuess? _guess;
    private FileRoleKind _roleKind = FileRoleKind.Other;
    private string _roleSite = NoSite;
    private bool _uploading;

    [Inject]
    private EvidenceAppender Appender { get; set; } = default!;

    [Inject]
    private MarkdownRenderer Markdown { get; set; } = default!;

    [Parameter, EditorRequired]
    public ReviewCase Case { get; set; } = default!;

    [Parameter, EditorRequired]
    public ChecklistItem Item { get; set; } = default!;

    /// <summary>The page's live session, to tell teammates on the item that a note is being written.</summary>
    [CascadingParameter]
    public Services.Live.LiveCaseSession? Live { get; set; }

    [Parameter, EditorRequired]
    public System.Security.Claims.ClaimsPrincipal User { get; set; } = default!;

    /// <summary>Largest upload, bytes.</summary>
    [Parameter]
    public long MaxBytes { get; set; } = 200L * 1024 * 1024;

    /// <summary>
    /// Runs one change and reports it (the item panel shows the success text or the error); returns true when it was stored.
    /// </summary>
    [Parameter, EditorRequired]
    public Func<Func<Task<ReviewCase>>, string, Task<bool>> Run { get; set; } = default!;

    /// <summary>Reports a refusal made before anything was sent (a file over the limit, an unreadable file).</summary>
    [Parameter]
    public EventCallback<string> OnError { get; set; }

    private IEnumerable<string> Sites => Case.Arrivals.Select(a => a.SiteCode).Order(StringComparer.Ordinal);

    private FileRole ChosenRole => new(_roleKind, FileRole.IsPerSite(_roleKind) && _roleSite != NoSite ? _roleSite : null);

    // True while a note is being stored: the button shows it and takes no second click (a slow save is not a lost click).
    private bool _addingNote;

    private async Task AddNote()
    {
        if (_addingNote)
        {
            return;
        }

        _addingNote = true;
        try
        {
            var text = _note;
            if (await Run(() => Appender.AddNoteAsync(User, Case.Id, Item.Key, text ?? string.Empty), "Note added."))
            {
                _note = null;
                _noteTab = 0;
                NoteEdited();
            }
        }
        finally
        {
            _addingNote = false;
        }
    }

    private void NoteEdited() => Live?.Doing(string.IsNullOrWhiteSpace(_note) ? null : "editing a note");

    private async Task AddLink()
    {
        if (await Run(() => Appender.AddLinkAsync(User, Case.Id, Item.Key, _linkUrl ?? string.Empty, _linkTitle ?? string.Empty), "Link added."))
        {
            _linkUrl = _linkTitle = null;
        }
    }

    private async Task OnFile(InputFileChangeEventArgs e)
    {
        if (e.File.Size > MaxBytes)
        {
            await OnError.InvokeAsync($"'{e.File.Name}' is {Bytes.Format(e.File.Size)}; the limit is {Bytes.Format(MaxBytes)}. Nothing was stored.");
            return;
        }

        // Read only the first bytes to guess the role; the whole file is sent when the role is confirmed.
        var head = new byte[Math.Min(FileRoleGuesser.HeadBytes, e.File.Size)];
        try
        {
            await using var s = e.File.OpenReadStream(MaxBytes);
            var read = 0;
            while (read < head.Length && await s.ReadAsync(head.AsMemory(read)) is var n and > 0)
            {
                read += n;
            }
        }
        catch (IOException ex)
        {
            await OnError.InvokeAsync($"'{e.File.Name}' could not be read: {ex.Message} Nothing was stored.");
            return;
        }

        _file = e.File;
        _guess = FileRoleGuesser.Guess(e.File.Name, head, [.. Sites]);
        _roleKind = _guess.Role.Kind;
        _roleSite = _guess.Role.Site ?? NoSite;
    }

    private void RoleKindChanged(FileRoleKind kind)
    {
        _roleKind = kind;
        if (!FileRole.IsPerSite(kind))
        {
            _roleSite = NoSite;
        }
    }

    private void CancelFile()
    {
        _file = null;
        _guess = null;
    }

    private async Task Attach()
    {
        if (_file is not { } file)
        {
            return;
        }

        _uploading = true;
        try
        {
            var role = ChosenRole;
            await using var stream = file.OpenReadStream(MaxBytes);
            if (await Run(() => Appender.AddAttachmentAsync(User, Case.Id, Item.Key, stream, file.Name, file.ContentType, _fileDescription ?? string.Empty, MaxBytes, role),
                    $"'{file.Name}' attached as {role.Title}."))
            {
                _file = null;
                _guess = null;
                _fileDescription = null;
            }
        }
        finally
        {
            _uploading = false;
        }
    }
}
